/**
 * The one seam between the pipeline and Astro. At config time it prepares the
 * exhibit (plan → text model → measures → charts), sets the site's base path,
 * serves the prepared exhibit to pages as `virtual:vitrine/exhibit`, and
 * watches the plan and texts so `astro dev` recomputes when they change.
 */
import type { AstroIntegration } from 'astro';
import { resolve } from 'node:path';
import { prepareExhibit } from '../pipeline/exhibit.ts';
import type { PreparedExhibit } from '../pipeline/stages/prepared.ts';
import { formatProblem } from '../pipeline/problems/problem.ts';

const MODULE_ID = 'virtual:vitrine/exhibit';
const RESOLVED_ID = '\0' + MODULE_ID;

export interface VitrineOptions {
  /** The exhibit plan. Default: $VITRINE_PLAN, else "content/exhibit.yaml". */
  plan?: string;
  /** Where measure results are cached. Default: ".vitrine/cache" beside the plan's folder. */
  cacheDir?: string;
}

export default function vitrine(options: VitrineOptions = {}): AstroIntegration {
  let prepared: PreparedExhibit | null = null;
  let watch: string[] = [];
  let prepare: (() => ReturnType<typeof prepareExhibit>) | null = null;
  return {
    name: 'vitrine',
    hooks: {
      'astro:config:setup': async ({ updateConfig, logger, config }) => {
        const root = config.root instanceof URL ? config.root.pathname : String(config.root);
        const planPath = resolve(root, process.env.VITRINE_PLAN ?? options.plan ?? 'content/exhibit.yaml');
        const envCache = process.env.VITRINE_CACHE_DIR;
        // An empty VITRINE_CACHE_DIR means "no cache" (vitrine build --no-cache).
        const cacheDir = envCache !== undefined ? envCache || null : (options.cacheDir ?? resolve(root, '.vitrine/cache'));
        const base = process.env.VITRINE_BASE || undefined;
        prepare = () => prepareExhibit(planPath, { cacheDir, base, log: (m) => logger.info(m) });
        const result = await prepare();
        for (const p of result.problems) {
          if (p.severity === 'warning') logger.warn(formatProblem(p));
        }
        watch = result.watch;
        if (!result.prepared) {
          const errors = result.problems.filter((p) => p.severity === 'error').map(formatProblem);
          throw new Error(`The exhibit cannot be built:\n${errors.join('\n')}`);
        }
        prepared = result.prepared;
        // Read by site/content.config.ts: which caption files to render, and from where.
        process.env.VITRINE_EXHIBIT_DIR = result.dir;
        process.env.VITRINE_CAPTIONS = JSON.stringify(prepared.captionFiles);
        updateConfig({
          base: prepared.exhibit.base,
          vite: {
            plugins: [
              {
                name: 'vitrine-exhibit',
                resolveId(id: string) {
                  return id === MODULE_ID ? RESOLVED_ID : undefined;
                },
                load(id: string) {
                  return id === RESOLVED_ID ? `export default ${JSON.stringify(prepared)};` : undefined;
                },
              },
            ],
          },
        });
      },

      // Live preview: the plan and texts are not modules Vite knows, so watch them here. A
      // change re-prepares the exhibit (the cache makes that quick) and reloads the page; a
      // plan with problems keeps the last good exhibit on screen and shows the problems.
      'astro:server:setup': ({ server, logger }) => {
        server.watcher.add(watch);
        const onChange = async (file: string) => {
          if (!watch.includes(resolve(file)) || !prepare) return;
          const result = await prepare();
          if (!result.prepared) {
            const errors = result.problems.filter((p) => p.severity === 'error').map(formatProblem).join('\n');
            logger.error(`The exhibit has problems; still showing the last good version:\n${errors}`);
            server.ws.send({ type: 'error', err: { message: `The exhibit has problems:\n${errors}`, stack: '' } });
            return;
          }
          const before = prepared!;
          prepared = result.prepared;
          watch = result.watch;
          server.watcher.add(watch);
          const sameCaptions = JSON.stringify(before.captionFiles) === JSON.stringify(prepared.captionFiles);
          if (!sameCaptions || before.exhibit.base !== prepared.exhibit.base) {
            // New caption files or a new base path change Astro's own configuration.
            await server.restart();
            return;
          }
          for (const env of Object.values(server.environments)) {
            const mod = env.moduleGraph.getModuleById(RESOLVED_ID);
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
