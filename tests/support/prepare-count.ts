/**
 * For vi.mock of pipeline/exhibit.ts: the real module, with every call of
 * prepareExhibit counted in `calls.prepare`. The command and the Astro
 * integration both reach prepareExhibit through that one module.
 */
export async function countingExhibit(original: () => Promise<typeof import('../../pipeline/exhibit.ts')>, calls: { prepare: number }) {
  const real = await original();
  return {
    ...real,
    prepareExhibit: (...args: Parameters<typeof real.prepareExhibit>) => {
      calls.prepare++;
      return real.prepareExhibit(...args);
    },
  };
}
