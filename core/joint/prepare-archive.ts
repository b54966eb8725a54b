import type { Site } from '../astrometry/site.ts';
import type { StarListRow } from '../formats/star-list.ts';
import type { TaskControl } from '../task/task-control.ts';
import type { TimeScale } from '../time/timescale.ts';
import { DEG } from '../units.ts';
import type { JointModel } from './joint-model.ts';
import type { JointNight, JointObservation } from './joint-observations.ts';
import { fillObservationFactors } from './observation-factors.ts';
import { reduceArchive } from './reduce-archive.ts';
import type { SegmentEvent } from './segment-terms.ts';
import type { SolveInputs } from './solve-inputs.ts';

/** Refusal of an archive the joint solve cannot take, with the reason in words. */
export class JointSolveRefused extends Error {
  override readonly name = 'JointSolveRefused';
}

/** An archive reduced night by night with every observation's parallax and aberration factors: what one or many joint solves start from. */
export interface PreparedArchive {
  readonly stars: readonly StarListRow[];
  readonly nights: readonly JointNight[];
  readonly observations: readonly JointObservation[];
  /** Nights the nightly reduction refused, with its reasons. */
  readonly skipped: readonly string[];
  /** The instruments' events (segment-terms.ts) and the site (geodetic latitude rad, height m; diurnal aberration); absent: no events, latitude 0. */
  readonly events?: readonly SegmentEvent[];
  readonly site?: { readonly latitudeRad: number; readonly heightM: number };
}

/** Refuses a prepared archive with fewer than two nights or two observed stars (nothing separates stars from the instrument). */
export function checkSolvable(prepared: PreparedArchive): void {
  const observed = new Set(prepared.observations.map((o) => o.star));
  if (prepared.nights.length < 2) throw new JointSolveRefused(`the archive has ${prepared.nights.length} reducible night(s); a joint solve needs at least two nights, as a single night cannot separate star positions from that night's instrument terms${prepared.skipped.length ? ` (refused nights: ${prepared.skipped.join('; ')})` : ''}`);
  if (observed.size < 2) throw new JointSolveRefused(`only ${observed.size} star is observed; a joint solve needs at least two stars, since with one star every night's clock and zero point absorb its position — solve it against the catalogue instead`);
}

/**
 * The nightly reductions (reduce-archive.ts) and the parallax/aberration factors of every
 * observation (observation-factors.ts); the joint problem is then built per model. The nightly
 * step depends on the model's stated precisions and a-priori flexure only, so solves that differ
 * in which terms are free (model comparison, cross-validation) share one PreparedArchive.
 */
export async function prepareArchive(inputs: SolveInputs, model: JointModel, timeScale: TimeScale, control: TaskControl): Promise<PreparedArchive> {
  const reduced = await reduceArchive(inputs, model, timeScale, control);
  const s = inputs.site.site;
  const prepared = {
    stars: inputs.stars, nights: reduced.nights, observations: reduced.observations, skipped: reduced.skipped,
    events: (inputs.events ?? []).map((e) => ({ instrumentId: e.instrumentId, utcMjd: e.utcMjd, kind: e.kind })), site: { latitudeRad: s.latitudeDeg * DEG, heightM: s.heightM },
  };
  checkSolvable(prepared);
  const site: Site = { latitudeRad: s.latitudeDeg * DEG, longitudeRad: s.longitudeDeg * DEG, heightM: s.heightM };
  fillObservationFactors(reduced.observations, inputs.stars, site, timeScale);
  return prepared;
}
