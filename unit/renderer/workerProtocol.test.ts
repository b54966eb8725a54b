import { describe, expect, test } from 'vitest';
import { Equatorial } from 'astronomia/coord';
import { WorkerDispatcher } from '../../renderer/worker/dispatcher.ts';
import { ComputeClient, type WorkerPort } from '../../renderer/worker/computeClient.ts';
import { parseToWorker, type FromWorker, type ToWorker } from '../../renderer/worker/protocol.ts';
import {
  ECLIPTIC_FIELD_CHUNK,
  MEAN_OBLIQUITY_J2000_RAD,
  equatorialToEcliptic,
  parkMiller,
  runEclipticField,
} from '../../renderer/worker/tasks/eclipticField.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { DEG, UAS } from '../../core/units.ts';

/**
 * astronomia ships no types; unit/astrometry declares 'astronomia/coord' without toEcliptic, so the
 * method used here is typed locally (coord.js: Equatorial.prototype.toEcliptic(ε), Meeus 13.1–13.2).
 */
interface MeeusEquatorial {
  toEcliptic(obliquityRad: number): { readonly lon: number; readonly lat: number };
}

const nextTurn = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/**
 * A worker and its page in one Node process: messages cross by structuredClone on a later turn
 * of the event loop, as postMessage does between threads.
 */
function connectedPair() {
  const pageListeners: ((event: { data: unknown }) => void)[] = [];
  const sentToPage: FromWorker[] = [];
  const dispatcher = new WorkerDispatcher(
    (message) => {
      sentToPage.push(message);
      setTimeout(() => pageListeners.forEach((listener) => listener({ data: structuredClone(message) })), 0);
    },
    nextTurn,
  );
  const port: WorkerPort = {
    postMessage: (message: ToWorker) => setTimeout(() => dispatcher.handle(structuredClone(message)), 0),
    addEventListener: (type: string, listener: (event: never) => void) => {
      if (type === 'message') pageListeners.push(listener as (event: { data: unknown }) => void);
    },
  };
  return { client: new ComputeClient(port), dispatcher, sentToPage };
}

describe('equatorialToEcliptic(raRad, decRad, obliquityRad)', () => {
  test('matches astronomia coord.Equatorial.toEcliptic (Meeus eq. 13.1–13.2) to 1 µas', () => {
    const random = parkMiller(12_345);
    for (let i = 0; i < 200; i++) {
      const raRad = 2 * Math.PI * random();
      const decRad = Math.asin(2 * random() - 1) * 0.999; // keep clear of the poles, where λ is undefined
      const ours = equatorialToEcliptic(raRad, decRad, MEAN_OBLIQUITY_J2000_RAD);
      const theirs = (new Equatorial(raRad, decRad) as unknown as MeeusEquatorial).toEcliptic(MEAN_OBLIQUITY_J2000_RAD);
      const dLon = Math.atan2(Math.sin(ours.longitudeRad - theirs.lon), Math.cos(ours.longitudeRad - theirs.lon));
      expect(Math.abs(dLon * Math.cos(ours.latitudeRad))).toBeLessThan(1 * UAS);
      expect(Math.abs(ours.latitudeRad - theirs.lat)).toBeLessThan(1 * UAS);
    }
  });

  test('Meeus example 13.a: Pollux α 116.328942°, δ 28.026183°, ε 23.4392911° → λ 113.215630°, β 6.684170°', () => {
    // Meeus, Astronomical Algorithms (2nd ed.), example 13.a, p. 95 (values quoted from memory;
    // the astronomia comparison above is the independent check).
    const result = equatorialToEcliptic(116.328942 * DEG, 28.026183 * DEG, 23.4392911 * DEG);
    expect(Math.abs(result.longitudeRad / DEG - 113.21563)).toBeLessThan(2e-6);
    expect(Math.abs(result.latitudeRad / DEG - 6.68417)).toBeLessThan(2e-6);
  });
});

describe('runEclipticField(request, control)', () => {
  test('the fraction near the ecliptic is sin 5° for stars uniform on the sphere', async () => {
    const result = await runEclipticField({ kind: 'ecliptic-field', starCount: 200_000, seed: 7 }, UNCONTROLLED);
    // |β| < 5° covers sin 5° = 0.08716 of the sphere; binomial σ = 0.00063 for 200 000 stars.
    expect(Math.abs(result.nearEclipticCount / 200_000 - Math.sin(5 * DEG))).toBeLessThan(4 * 0.00063);
    expect(result.maxRoundTripErrorRad).toBeLessThan(1e-15);
  });

  test('rejects a starCount that is not a positive integer with a message', async () => {
    await expect(runEclipticField({ kind: 'ecliptic-field', starCount: 0, seed: 1 }, UNCONTROLLED))
      .rejects.toThrow(/starCount must be a positive integer, got 0/);
  });
});

describe('WorkerDispatcher and ComputeClient', () => {
  test('a job reports increasing progress up to the total, then finishes', async () => {
    const { client } = connectedPair();
    const progress: [number, number][] = [];
    const starCount = 3 * ECLIPTIC_FIELD_CHUNK + 5;
    const job = client.run({ kind: 'ecliptic-field', starCount, seed: 3 }, (done, total) => progress.push([done, total]));
    const outcome = await job.outcome;
    expect(outcome.kind).toBe('finished');
    expect(progress.map(([done]) => done)).toEqual([20_000, 40_000, 60_000, starCount]);
    expect(progress.every(([, total]) => total === starCount)).toBe(true);
  });

  test('cancel() after the first progress stops the job before the end', async () => {
    const { client, dispatcher } = connectedPair();
    const starCount = 100 * ECLIPTIC_FIELD_CHUNK;
    const started: { job?: ReturnType<ComputeClient['run']> } = {};
    const job = client.run({ kind: 'ecliptic-field', starCount, seed: 3 }, () => started.job?.cancel());
    started.job = job;
    const outcome = await job.outcome;
    expect(outcome.kind).toBe('cancelled');
    if (outcome.kind !== 'cancelled') return;
    expect(outcome.done).toBeGreaterThan(0);
    expect(outcome.done).toBeLessThan(starCount);
    expect(dispatcher.runningJobCount).toBe(0);
  });

  test('a task that throws ends its job as failed with the task message', async () => {
    const { client } = connectedPair();
    const outcome = await client.run({ kind: 'ecliptic-field', starCount: -3, seed: 1 }).outcome;
    expect(outcome).toEqual({ kind: 'failed', message: 'ecliptic-field: starCount must be a positive integer, got -3' });
  });

  test('a malformed message is answered with failed, not dropped', () => {
    const sent: FromWorker[] = [];
    const dispatcher = new WorkerDispatcher((message) => sent.push(message), nextTurn);
    dispatcher.handle({ type: 'start', jobId: 'j1', request: { kind: 'no-such-task' } });
    dispatcher.handle('hello');
    expect(sent).toEqual([
      { type: 'failed', jobId: 'j1', message: 'start message for job j1: unknown task kind "no-such-task"' },
      { type: 'failed', jobId: '', message: 'worker message must be an object, got string' },
    ]);
  });
});

describe('parseToWorker(message)', () => {
  test('accepts a cancel and a start, and names a bad type', () => {
    expect(parseToWorker({ type: 'cancel', jobId: 'a' })).toEqual({ type: 'cancel', jobId: 'a' });
    expect(parseToWorker({ type: 'start', jobId: 'b', request: { kind: 'ecliptic-field', starCount: 5, seed: 2 } }))
      .toEqual({ type: 'start', jobId: 'b', request: { kind: 'ecliptic-field', starCount: 5, seed: 2 } });
    expect(parseToWorker({ type: 'pause', jobId: 'c' })).toBe('worker message type must be "start" or "cancel", got "pause"');
    expect(parseToWorker({ type: 'cancel' })).toBe('worker message needs a non-empty string jobId');
  });
});
