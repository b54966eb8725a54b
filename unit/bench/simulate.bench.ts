// The archive simulator at the brief's size: 10 years × 50 stars, default nights, and a dense
// programme (250 nights a year) that reaches ~50k transits; plus writing the archive folder.
import { writeArchiveFolder } from '../../core/archive-folder/archive-folder.ts';
import { simulateArchive } from '../../core/simulate/simulate-archive.ts';

async function timed(label: string, request: Parameters<typeof simulateArchive>[0]): Promise<void> {
  const start = performance.now();
  const archive = await simulateArchive(request);
  const simulated = performance.now();
  const files = writeArchiveFolder(archive, archive.truth);
  const written = performance.now();
  const bytes = [...files.values()].reduce((sum, text) => sum + text.length, 0);
  const perTransitUs = ((simulated - start) * 1000) / archive.transits.length;
  console.log(`   ${label}: ${archive.nights.length} nights, ${archive.transits.length} transits in ${((simulated - start) / 1000).toFixed(1)} s (${perTransitUs.toFixed(0)} µs/transit); folder ${(bytes / 1e6).toFixed(1)} MB in ${((written - simulated) / 1000).toFixed(1)} s`);
}

export async function run(): Promise<void> {
  await timed('10 years × 50 stars, defaults', { seed: 1, years: 10, starCount: 50 });
  await timed('10 years × 50 stars, 250 nights/yr', { seed: 1, years: 10, starCount: 50, nightsPerYearTarget: 250 });
}
