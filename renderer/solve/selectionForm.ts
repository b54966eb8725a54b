import type { SolveSelection } from './solveSelection.ts';

/** The selection as the form edits it: ticked ids, and dates as typed (YYYY-MM-DD or empty). */
export interface SelectionForm {
  everyStar: boolean;
  starIds: string[];
  everyInstrument: boolean;
  instrumentIds: string[];
  fromDate: string;
  untilDate: string;
}

export const EMPTY_SELECTION_FORM: SelectionForm = { everyStar: true, starIds: [], everyInstrument: true, instrumentIds: [], fromDate: '', untilDate: '' };

const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** The form → a SolveSelection, or the problems in words (a bad date, an empty tick list, dates the wrong way round). */
export function selectionFromForm(form: SelectionForm): { selection: SolveSelection | null; problems: string[] } {
  const problems: string[] = [];
  if (!form.everyStar && form.starIds.length < 2) problems.push('Tick at least two star ids: one star alone cannot be told from the instrument.');
  if (!form.everyInstrument && form.instrumentIds.length === 0) problems.push('Tick at least one instrument.');
  for (const [name, value] of [['From', form.fromDate], ['Until', form.untilDate]] as const) {
    if (value !== '' && !DATE.test(value)) problems.push(`${name} date "${value}" must be YYYY-MM-DD or empty.`);
  }
  if (form.fromDate !== '' && form.untilDate !== '' && form.fromDate > form.untilDate) problems.push(`From date ${form.fromDate} is after the until date ${form.untilDate}.`);
  if (problems.length > 0) return { selection: null, problems };
  return {
    selection: {
      starIds: form.everyStar ? null : [...form.starIds].sort(), instrumentIds: form.everyInstrument ? null : [...form.instrumentIds].sort(),
      fromDate: form.fromDate === '' ? null : form.fromDate, untilDate: form.untilDate === '' ? null : form.untilDate,
    },
    problems,
  };
}

/** A selection in one line for the saved-solve list. */
export function describeSelection(selection: SolveSelection): string {
  const stars = selection.starIds === null ? 'every star' : `${selection.starIds.length} chosen star ids`;
  const instruments = selection.instrumentIds === null ? 'every instrument' : selection.instrumentIds.join(', ');
  const span = selection.fromDate === null && selection.untilDate === null ? 'all dates' : `${selection.fromDate ?? 'start'} to ${selection.untilDate ?? 'end'}`;
  return `${stars}; ${instruments}; ${span}`;
}
