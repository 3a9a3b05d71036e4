/**
 * The one seam between the pipeline and Astro. It is handed the prepared
 * exhibit (by `vitrine build` and `vitrine dev`, which prepare it once and
 * check it before Astro starts), or prepares it itself from a plan when Astro
 * runs on its own (astro check). It sets the site's base path, serves the
 * exhibit to pages as `virtual:vitrine/exhibit` and the caption files to the
 * content collection as `virtual:vitrine/captions`, and in the live preview
 * watches the plan and texts, preparing the exhibit again once per change.
 */
import type { AstroIntegration } from 'astro';
import { resolve } from 'node:path';
import { prepareExhibit } from '../pipeline/exhibit.ts';
import type { PrepareResult } from '../pipeline/exhibit.ts';
import type { PreparedExhibit } from '../pipeline/stages/prepared.ts';
import { formatProblem } from '../pipeline/problems/problem.ts';

const EXHIBIT_ID = 'virtual:vitrine/exhibit';
const CAPTIONS_ID = 'virtual:vitrine/captions';
/** How long a burst of file events must be quiet before the live preview prepares again. */
const SETTLE_MS = 120;

export interface VitrineOptions {
  /** The exhibit plan (relative to the project folder, or absolute). Default: "content/exhibit.yaml". */
  plan?: string;
  /** The exhibit as already prepared from `plan`: used as it is until a watched file changes. Default: prepared at config time. */
  prepared?: PrepareResult;
  /** Where measure results are cached; null keeps none. Default: ".vitrine/cache" in the project folder. */
  cacheDir?: string | null;
  /** Serve the site under this base path instead of the plan's. */
  base?: string;
}

interface Ready extends PrepareResult {
  prepared: PreparedExhibit;
}

export default function vitrine(options: VitrineOptions = {}): AstroIntegration {
  let current: Ready | null = options.prepared?.prepared ? (options.prepared as Ready) : null;
  let prepare: (() => Promise<PrepareResult>) | null = null;
  return {
    name: 'vitrine',
    hooks: {
      'astro:config:setup': async ({ updateConfig, logger, config }) => {
        const root = config.root instanceof URL ? config.root.pathname : String(config.root);
        const planPath = resolve(root, options.plan ?? 'content/exhibit.yaml');
        const cacheDir = options.cacheDir !== undefined ? options.cacheDir : resolve(root, '.vitrine/cache');
        prepare = () => prepareExhibit(planPath, { cacheDir, base: options.base, log: (m) => logger.info(m) });
        // A restart of the live preview runs this hook again: keep what is already prepared.
        if (!current) {
          const result = await prepare();
          for (const p of result.problems) if (p.severity === 'warning') logger.warn(formatProblem(p));
          if (!result.prepared) {
            const errors = result.problems.filter((p) => p.severity === 'error').map(formatProblem);
            throw new Error(`The exhibit cannot be built:\n${errors.join('\n')}`);
          }
          current = result as Ready;
        }
        updateConfig({
          base: current.prepared.exhibit.base,
          vite: {
            plugins: [
              {
                name: 'vitrine-exhibit',
                resolveId(id: string) {
                  return id === EXHIBIT_ID || id === CAPTIONS_ID ? '\0' + id : undefined;
                },
                load(id: string) {
                  if (id === '\0' + EXHIBIT_ID) return `export default ${JSON.stringify(current!.prepared)};`;
                  if (id === '\0' + CAPTIONS_ID) return `export const dir = ${JSON.stringify(current!.dir)};\nexport const files = ${JSON.stringify(current!.prepared.captionFiles)};`;
                  return undefined;
                },
              },
            ],
          },
        });
      },

      // Live preview: the plan and texts are not modules Vite knows, so watch them here. A
      // change prepares the exhibit again (the cache makes that quick) and reloads the page; a
      // plan with problems keeps the last good exhibit on screen and shows the problems.
      'astro:server:setup': ({ server, logger }) => {
        server.watcher.add(current!.watch);
        // One preparation per change. An editor's save can arrive as several events, the first
        // while the file is still being written: wait for the burst to settle, prepare once,
        // and prepare again if another change came in meanwhile.
        let running: Promise<void> | null = null;
        let again = false;
        const onChange = (file: string) => {
          if (!current!.watch.includes(resolve(file)) || !prepare) return;
          if (running) {
            again = true;
            return;
          }
          running = (async () => {
            try {
              do {
                again = false;
                await new Promise((settled) => setTimeout(settled, SETTLE_MS));
                await refresh();
              } while (again);
            } catch (e) {
              logger.error(`The exhibit could not be prepared again: ${(e as Error).message}`);
            } finally {
              running = null;
            }
          })();
        };
        const refresh = async () => {
          const result = await prepare!();
          if (!result.prepared) {
            const errors = result.problems.filter((p) => p.severity === 'error').map(formatProblem).join('\n');
            logger.error(`The exhibit has problems; still showing the last good version:\n${errors}`);
            server.ws.send({ type: 'error', err: { message: `The exhibit has problems:\n${errors}`, stack: '' } });
            return;
          }
          const before = current!.prepared;
          current = result as Ready;
          server.watcher.add(current.watch);
          const sameCaptions = JSON.stringify(before.captionFiles) === JSON.stringify(current.prepared.captionFiles);
          if (!sameCaptions || before.exhibit.base !== current.prepared.exhibit.base) {
            // New caption files or a new base path change Astro's own configuration.
            await server.restart();
            return;
          }
          for (const env of Object.values(server.environments)) {
            const mod = env.moduleGraph.getModuleById('\0' + EXHIBIT_ID);
            if (mod) env.moduleGraph.invalidateModule(mod);
          }
          logger.info('Exhibit updated.');
          server.ws.send({ type: 'full-reload' });
        };
        server.watcher.on('change', onChange);
        server.watcher.on('add', onChange);
      },
    },
  };
}
