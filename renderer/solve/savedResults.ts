import type { ReductionRecord } from '../../core/archive/records.ts';
import type { JointModel } from '../../core/joint/joint-model.ts';
import type { ArchiveSolveResult } from '../../core/joint/solve-archive.ts';
import type { SolveSelection } from './solveSelection.ts';

/**
 * The part of a saved reduction's results (core/joint/solve-result-json.ts) the Solve view shows: the JSON-safe
 * fields of the joint solve's own result, plus the nights per star the task adds.
 */
export interface SavedResults
  extends Pick<ArchiveSolveResult, 'stars' | 'global' | 'unitWeightError' | 'chiSquare' | 'degreesOfFreedom' | 'degeneracies' | 'notes' | 'instrumentSeries'> {
  readonly starNights: Readonly<Record<string, number>>;
}

/** A saved reduction's results, typed; the record was written by the joint-solve task. */
export function savedResults(record: ReductionRecord): SavedResults {
  return record.results as unknown as SavedResults;
}

/** The model and selection a saved reduction was run with (as the joint-solve task stores them). */
export function savedConfiguration(record: ReductionRecord): { model: JointModel; selection: SolveSelection } {
  return record.modelConfiguration as unknown as { model: JointModel; selection: SolveSelection };
}

/**
 * What the degeneracy report (core/joint/degeneracy-words.ts: "weak combination (condition index
 * 66): parallax of star A07: seen only in May–July; … — left to the data") says about star `id`:
 * of each sentence only the phrases naming that star, prefixed with the sentence's status (how it
 * was resolved stays in the full list), so the star table can show them beside the star. Sentences of another shape are kept whole when they name the star.
 */
export function degeneraciesOfStar(degeneracies: readonly string[], id: string): string[] {
  const escaped = id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const names = new RegExp(`\\bstar ${escaped}(?![\\w-])`);
  const out: string[] = [];
  for (const sentence of degeneracies) {
    if (!names.test(sentence)) continue;
    const parts = /^(\S+) combination \(condition index \d+\): (.*) — [^—]*$/.exec(sentence);
    if (parts === null) { out.push(sentence); continue; }
    for (const phrase of parts[2].split('; ').filter((p) => names.test(p))) {
      const text = `${parts[1]}: ${phrase.replace(` of star ${id}`, '')}`;
      if (!out.includes(text)) out.push(text);
    }
  }
  return out;
}
