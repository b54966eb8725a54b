import { encodeUtf8 } from '../../core/text/utf8-encode.ts';
import type { TaskControl } from '../../core/task/task-control.ts';

// Invented scenario (no real site, instrument or star): only structure and arithmetic matter.
export const SITE_JSON = JSON.stringify({
  formatVersion: 1,
  site: { id: 'quarry-hill', label: 'Quarry Hill pier (invented)', latitudeDeg: 51.2031, longitudeDeg: 9.4417, heightM: 288.5 },
  instruments: [
    {
      id: 'qt-2', label: 'Quarry transit 2', kind: 'transit', zenithScale: { unit: 'turn', arcsecPerUnit: 48.77, sense: -1 },
      wireIntervalsS: [15.2, 0, -15.1], effectiveWavelengthUm: 0.6, clockId: 'clock-q', clockTimeScale: 'sidereal',
      events: [{ date: '2026-02-01', kind: 'cleaning', note: 'objective dusted' }],
    },
  ],
});

export const STAR_LIST_CSV = [
  'id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas,parallaxSigmaMas,radialVelocityKmS,magnitude,source,programme',
  'QX-1,Invented one,84.1234567890123,22.4411,2016.0,-1.25,3.5,4.125,0.02,,5.5,invented,clock',
  'QX-2,Invented two,130.5,61.25,2016.0,,,,,,,invented,clock;latitude',
  'QX-3,Bad one,400,10,2016.0,,,,,,,invented,',
].join('\n');

/** One transit log row of star `starId` on day `day` (0-based) after 2026-03-01. */
export function transitLine(starId: string, day: number, wireSeconds = [10.1, 25.3, 40.4]): string {
  const date = new Date(Date.UTC(2026, 2, 1 + day));
  const iso = date.toISOString().slice(0, 10);
  const wires = wireSeconds.map((s) => `${iso}T21:07:${s.toFixed(2).padStart(5, '0')}Z`);
  return `${starId},upper,west,${iso},qt-2,ZK,${wires.join(',')},12.5,3.5,1002.5,,`;
}

export const TRANSIT_HEADER = 'starId,culmination,clamp,nightDate,instrumentId,observer,wire1Utc,wire2Utc,wire3Utc,micrometerTurns,temperatureC,pressureHpa,flags,note';

export function transitLog(lines: readonly string[]): Uint8Array {
  return encodeUtf8([TRANSIT_HEADER, ...lines].join('\n'));
}

/** A control that runs `onYield` at every chunk boundary; cancel by setting `cancelled`. */
export function watchingControl(onYield: (calls: number) => Promise<void> | void): TaskControl & { cancelled: boolean } {
  let calls = 0;
  const control = {
    cancelled: false,
    cancellation: { get isCancelled() { return control.cancelled; } },
    reportProgress: () => {},
    yieldToHost: async () => {
      calls++;
      await onYield(calls);
    },
  };
  return control;
}

export const NOW = '2026-03-20T12:00:00.000Z';
