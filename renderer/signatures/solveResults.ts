import type { CorrelationMatrix, NightInstrumentTerms, ObservationResidual } from '../../core/joint/solve-outputs.ts';
import type { StarSignature } from '../../core/joint/star-signatures.ts';
import type { InstrumentCommonMode } from '../../core/joint/common-mode.ts';
import type { ReductionRecord } from '../../core/archive/records.ts';

/**
 * The parts of a saved solve (the JSON of `meridian-ledger solve DIR --json --residuals`) that
 * the Signatures view plots. The types are the solver's own; this file only checks that a saved
 * record has them, so that a record from an older or broken solve is refused with a message
 * instead of drawing empty plots.
 */
export interface SignatureData {
  readonly correlation: CorrelationMatrix;
  readonly instrumentSeries: readonly NightInstrumentTerms[];
  readonly stars: readonly StarSignature[];
  readonly instruments: readonly InstrumentCommonMode[];
  /** Empty when the solve was saved without its residuals. */
  readonly residuals: readonly ObservationResidual[];
}

function need(value: unknown, what: string, label: string): unknown {
  if (value === undefined || value === null) {
    throw new Error(`The saved reduction "${label}" has no ${what}; solve the archive again (Solve view) to save a complete result.`);
  }
  return value;
}

function needArray(value: unknown, what: string, label: string): readonly unknown[] {
  if (!Array.isArray(need(value, what, label))) throw new Error(`The saved reduction "${label}": ${what} is not a list; solve the archive again.`);
  return value as readonly unknown[];
}

/** Reads the plotted parts of a saved reduction; throws naming the missing part and the fix. */
export function signatureDataOf(record: Pick<ReductionRecord, 'label' | 'results' | 'residuals'>): SignatureData {
  const { results, label } = record;
  const correlation = need(results.correlation, 'correlation matrix', label) as CorrelationMatrix;
  needArray(correlation.names, 'correlation.names', label);
  needArray(correlation.matrix, 'correlation.matrix', label);
  const signatures = need(results.signatures, 'signatures (dial, ellipses, periodograms)', label) as Record<string, unknown>;
  const stars = needArray(signatures.stars, 'signatures.stars', label) as readonly StarSignature[];
  const instruments = needArray(signatures.instruments, 'signatures.instruments', label) as readonly InstrumentCommonMode[];
  const instrumentSeries = needArray(results.instrumentSeries, 'instrumentSeries', label) as readonly NightInstrumentTerms[];
  // The Solve view may keep residuals in the record's own column or inside results (as the CLI prints them).
  const ownResiduals = Array.isArray(record.residuals) && record.residuals.length > 0 ? record.residuals : null;
  const residuals = (ownResiduals ?? (Array.isArray(results.residuals) ? results.residuals : [])) as readonly ObservationResidual[];
  return { correlation, instrumentSeries, stars, instruments, residuals };
}
