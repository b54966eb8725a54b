import type { ArchiveDatabase } from '../store/database.ts';

/** The archive's words for the report header and the stars' labels, read from the store. */
export async function loadReportSources(database: ArchiveDatabase | null): Promise<{ archiveLabel: string; starLabels: Map<string, string> }> {
  if (database === null) return { archiveLabel: 'the open archive (its name could not be read)', starLabels: new Map() };
  const [sites, stars] = await Promise.all([database.sites.toArray(), database.stars.toArray()]);
  const visibleSites = sites.filter((s) => s.visibility === 'visible').map((s) => s.label);
  const archiveLabel = `${visibleSites.length === 0 ? 'no site recorded' : visibleSites.join(', ')} (archive “${database.name}” in this app)`;
  return { archiveLabel, starLabels: new Map(stars.map((s) => [s.id, s.label])) };
}
