// The Solve view's model form for the per-segment choice and the new terms (renderer/solve/modelTerms.ts):
// every choice it offers must be one parseJointModel accepts (core/joint/joint-model.ts), and a change is worded.
import { describe, expect, it } from 'vitest';
import { DEFAULT_JOINT_MODEL, parseJointModel, SEGMENTABLE_TERMS } from '../../core/joint/joint-model.ts';
import { modelDifferences, SPANS, TERM_GROUPS } from '../../renderer/solve/modelTerms.ts';

describe('modelTerms per-segment choices', () => {
  it('offers a span choice for exactly the terms that can span segments, each accepted by the model parser', () => {
    const spanned = TERM_GROUPS.flatMap((g) => g.terms.flatMap((t) => (t.spans ? [t.spans] : [])));
    expect([...spanned].sort()).toEqual([...SEGMENTABLE_TERMS].sort());
    for (const term of spanned) for (const span of SPANS) expect(parseJointModel(JSON.stringify({ termSpan: { [term]: span } })).problems, `${term} ${span}`).toEqual([]);
  });

  it('lists latitude variation and the diurnal-aberration scale, and words a span change and variance components', () => {
    const keys = TERM_GROUPS.flatMap((g) => g.terms.map((t) => t.key));
    expect(keys).toContain('latitudeVariation');
    expect(keys).toContain('diurnalAberrationScale');
    const changed = { ...DEFAULT_JOINT_MODEL, termSpan: { ...DEFAULT_JOINT_MODEL.termSpan, collimation: 'per-segment' as const }, varianceComponents: true };
    expect(modelDifferences(DEFAULT_JOINT_MODEL, changed)).toEqual([
      'Weights from the residuals (variance components): false → true',
      'Segments: every term per night → collimation per segment',
    ]);
  });
});
