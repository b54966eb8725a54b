import type { InstrumentRecord, NightRecord, SiteRecord, StarRecord, TransitRecord } from '../../core/archive/records.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import type { ComputeClient } from '../worker/computeClient.ts';
import type { PredictedTransit } from '../worker/tasks/tonightProgramme.ts';
import { loadChoices, saveChoices, type TonightChoices } from './draftStorage.ts';
import { nightWindowAt, nightWindowOfDate, type NightWindow } from './nightWindow.ts';
import { nextObservableIndex, programmeRows, type ProgrammeRow, type TonightSetting } from './programmeRows.ts';
import { findNight, nightTransits } from './tonightStore.ts';
import { loadProgrammeInputs, saveProgrammeInputs, type ProgrammeInputs } from './programmeSnapshot.ts';

const MJD_OF_UNIX_EPOCH = 40_587;
/** After 06:00 local mean time "tonight" is the coming evening (common practice for night logs). */
const COMING_NIGHT_SHIFT_DAYS = 6 / 24;

/** The JS clock as UTC MJD: the one place the Tonight view turns a Date into a Julian date. */
export const utcMjdOfMs = (ms: number): number => MJD_OF_UNIX_EPOCH + ms / 86_400_000;

const parseNumber = (text: string): number | null => (text.trim() === '' || !Number.isFinite(Number(text)) ? null : Number(text));

/** Everything the Tonight view shows and edits, read from the archive and the worker. */
export class TonightState {
  sites = $state.raw<readonly SiteRecord[]>([]);
  instruments = $state.raw<readonly InstrumentRecord[]>([]);
  stars = $state.raw<readonly StarRecord[]>([]);
  choices = $state<{ -readonly [K in keyof TonightChoices]: TonightChoices[K] }>(loadChoices({
    siteId: '', instrumentId: '', nightDate: '', zeroPointText: '0', clockOffsetText: '', timeToleranceText: '0.3', zenithToleranceText: '2', clamp: 'west',
  }));
  transits = $state.raw<readonly PredictedTransit[]>([]);
  phase = $state<'idle' | 'computing' | 'ready' | 'failed'>('idle');
  problem = $state<string | null>(null);
  /** Warnings of the programme's predictions (e.g. the night lies beyond the Earth orientation tables) and the tables used. */
  notes = $state.raw<readonly string[]>([]);
  tablesInUse = $state('');
  night = $state.raw<NightRecord | null>(null);
  logged = $state.raw<readonly TransitRecord[]>([]);
  nowMs = $state(Date.now());
  /** The archive, once open; until then the programme comes from the last session's copy (programmeSnapshot.ts). */
  database = $state.raw<ArchiveDatabase | null>(null);
  readonly #compute: ComputeClient;
  readonly #databaseName: string;
  readonly #storage: Storage | null;
  #opened: (database: ArchiveDatabase) => void = () => {};
  /** Resolves with the archive once it is open: writes wait for it. */
  readonly whenOpen = new Promise<ArchiveDatabase>((resolve) => (this.#opened = resolve));
  /** Numbers the programme requests, so that only the newest one's answer is shown. */
  #request = 0;

  constructor(compute: ComputeClient, databaseName: string, storage: Storage | null) {
    this.#compute = compute;
    this.#databaseName = databaseName;
    this.#storage = storage;
  }

  readonly site = $derived(this.sites.find((s) => s.id === this.choices.siteId) ?? this.sites[0]);
  readonly instrument = $derived(
    this.instruments.find((i) => i.id === this.choices.instrumentId && i.siteId === this.site?.id) ?? this.instruments.find((i) => i.siteId === this.site?.id),
  );
  readonly nowUtcMjd = $derived(utcMjdOfMs(this.nowMs));
  readonly window = $derived.by((): NightWindow | null => {
    if (this.site === undefined) return null;
    try {
      return this.choices.nightDate === '' ? nightWindowAt(this.nowUtcMjd + COMING_NIGHT_SHIFT_DAYS, this.site.longitudeDeg) : nightWindowOfDate(this.choices.nightDate, this.site.longitudeDeg);
    } catch {
      return null;
    }
  });
  /** The clock offset: the night's latest clock comparison, else the one the user states, else none. */
  readonly clockMinusUtcS = $derived.by((): number | null => {
    const comparisons = this.night?.clockComparisons ?? [];
    if (comparisons.length > 0) return comparisons[comparisons.length - 1].clockMinusUtcS;
    return parseNumber(this.choices.clockOffsetText);
  });
  readonly zeroPointDeg = $derived(parseNumber(this.choices.zeroPointText) ?? 0);
  readonly tolerances = $derived({ timeS: parseNumber(this.choices.timeToleranceText) ?? 0.3, zenithArcsec: parseNumber(this.choices.zenithToleranceText) ?? 2 });
  readonly setting = $derived<TonightSetting>({ zeroPointDeg: this.zeroPointDeg, clockMinusUtcS: this.clockMinusUtcS });
  readonly rows = $derived.by((): ProgrammeRow[] => {
    if (this.instrument === undefined) return [];
    try {
      return programmeRows(this.transits, this.stars, this.instrument, this.setting);
    } catch {
      return [];
    }
  });
  /** Programme rows already logged tonight (same star and culmination within 20 min). */
  // eslint-disable-next-line svelte/prefer-svelte-reactivity -- rebuilt whole by $derived, never mutated
  readonly loggedKeys = $derived(new Set(this.rows.filter((row) => this.logged.some((t) => t.starId === row.star.id && t.culmination === row.transit.culmination && Math.abs(t.utcMjd - row.transit.utcMjd) < 20 / 1440)).map((row) => row.key)));
  readonly nextIndex = $derived(nextObservableIndex(this.rows, this.nowUtcMjd, this.loggedKeys));

  /** Shows the last session's copy of the sites, instruments and stars; false when there is none. */
  showCopy(): boolean {
    const copy = loadProgrammeInputs(this.#storage, this.#databaseName);
    if (copy === null) return false;
    this.#take(copy);
    return true;
  }

  /** Reads the sites, instruments and stars from the open archive (over any copy) and keeps a copy for the next launch. */
  async attach(database: ArchiveDatabase): Promise<void> {
    const visible = <T extends { visibility: string }>(rows: T[]) => rows.filter((row) => row.visibility === 'visible');
    const [sites, instruments, stars] = await Promise.all([
      database.sites.orderBy('label').toArray(), database.instruments.orderBy('label').toArray(), database.stars.orderBy('catalogueId').toArray(),
    ]);
    const inputs = { sites: visible(sites), instruments: visible(instruments), stars: visible(stars) };
    this.database = database;
    this.#take(inputs);
    this.#opened(database);
    saveProgrammeInputs(this.#storage, database.name, inputs);
  }

  #take(inputs: ProgrammeInputs): void {
    this.sites = inputs.sites;
    this.instruments = inputs.instruments;
    this.stars = inputs.stars;
    this.settleChoices();
  }

  /** Makes the remembered site and instrument ids name rows that exist (the first ones otherwise). */
  settleChoices(): void {
    if (!this.sites.some((s) => s.id === this.choices.siteId)) this.choices.siteId = this.sites[0]?.id ?? '';
    const atSite = this.instruments.filter((i) => i.siteId === this.choices.siteId);
    if (!atSite.some((i) => i.id === this.choices.instrumentId)) this.choices.instrumentId = atSite[0]?.id ?? '';
  }

  remember(): void {
    saveChoices($state.snapshot(this.choices));
  }

  /** Reads tonight's night record and its transits (after a write, or a change of night). */
  async loadNight(): Promise<void> {
    const window = this.window;
    const database = this.database;
    if (this.instrument === undefined || window === null || database === null) return;
    const night = await findNight(database, this.instrument.id, window.localDate);
    this.night = night ?? null;
    this.logged = night === undefined ? [] : await nightTransits(database, night.id);
  }

  /**
   * Computes the programme in the worker for the chosen site, night and weather: with the
   * archive's leap seconds and Earth orientation once it is open, with the bundled tables before
   * (tablesInUse says which). A request overtaken by a newer one leaves the newer one's answer.
   */
  async computeProgramme(): Promise<void> {
    const window = this.window;
    const site = this.site;
    if (site === undefined || window === null || this.stars.length === 0) return;
    this.phase = 'computing';
    const w = this.night?.weather ?? null;
    const weather = w === null ? null : {
      pressureHpa: w.pressureHpa, temperatureC: w.temperatureC, relativeHumidity: w.relativeHumidityPercent / 100,
      wavelengthUm: (this.instrument?.effectiveWavelengthNm ?? 550) / 1000,
    };
    const request = ++this.#request;
    const job = this.#compute.run({
      kind: 'tonight-programme', site, stars: this.stars, fromUtcMjd: window.fromUtcMjd, untilUtcMjd: window.untilUtcMjd, weather, databaseName: this.database?.name,
    });
    const outcome = await job.outcome;
    if (request !== this.#request) return;
    if (outcome.kind === 'finished' && outcome.result.kind === 'tonight-programme') {
      this.transits = outcome.result.transits;
      this.notes = outcome.result.notes;
      this.tablesInUse = outcome.result.tablesInUse;
      this.phase = 'ready';
      this.problem = outcome.result.failures.length === 0 ? null : outcome.result.failures.map((f) => `${f.starId}: ${f.reason}`).join('; ');
    } else {
      this.phase = 'failed';
      this.problem = outcome.kind === 'failed' ? outcome.message : 'the programme computation was cancelled';
    }
  }
}
