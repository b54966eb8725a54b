import type { ArchiveContent } from '../../core/archive-folder/archive-folder.ts';

/**
 * `content` with every star's record id replaced by its catalogue id, and each transit's star id
 * with it. The archive folder's star list has one id column, the catalogue id
 * (core/archive-folder/star-file.ts refuses a star whose two ids differ), but stars imported
 * through Exchange get a random record id: without this the joint solve and the nightly
 * reductions, which go through the folder files, refuse every imported archive. Results then name
 * stars by catalogue id, as for the demo archive (whose two ids are equal). Two stars sharing a
 * catalogue id cannot be told apart in the folder and are refused with both record ids.
 */
export function keyedByCatalogueId(content: ArchiveContent): ArchiveContent {
  const catalogueIdOf = new Map<string, string>();
  const recordIdOf = new Map<string, string>();
  for (const star of content.stars) {
    const earlier = recordIdOf.get(star.catalogueId);
    if (earlier !== undefined) {
      throw new Error(`Stars ${earlier} and ${star.id} both have the catalogue id ${star.catalogueId}; give one of them another id in the Archive view, or leave one out.`);
    }
    recordIdOf.set(star.catalogueId, star.id);
    catalogueIdOf.set(star.id, star.catalogueId);
  }
  if (content.stars.every((s) => s.id === s.catalogueId)) return content;
  return {
    ...content,
    stars: content.stars.map((s) => (s.id === s.catalogueId ? s : { ...s, id: s.catalogueId })),
    transits: content.transits.map((t) => {
      const catalogueId = catalogueIdOf.get(t.starId) ?? t.starId;
      return catalogueId === t.starId ? t : { ...t, starId: catalogueId };
    }),
  };
}
