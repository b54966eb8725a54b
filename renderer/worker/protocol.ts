import type { EclipticFieldRequest, EclipticFieldResult } from './tasks/eclipticField.ts';
import { isExchangeKind, type ExchangeRequest, type ExchangeResult } from './tasks/exchangeTasks.ts';
import type { TonightProgrammeRequest, TonightProgrammeResult } from './tasks/tonightProgramme.ts';
import type { JointSolveRequest, JointSolveResult, SolveFingerprintRequest, SolveFingerprintResult } from './tasks/jointSolve.ts';
import type { NightQualityRequest, NightQualityResult } from './tasks/nightQuality.ts';

/**
 * The messages between the renderer and the compute worker. Hand-written discriminated unions:
 * `type` says what a message is; `jobId` ties every answer to the request that caused it.
 */

/** What a job computes; one member per task the worker knows. */
export type TaskRequest = EclipticFieldRequest | ExchangeRequest | TonightProgrammeRequest | JointSolveRequest | SolveFingerprintRequest | NightQualityRequest;
export type TaskResult = EclipticFieldResult | ExchangeResult | TonightProgrammeResult | JointSolveResult | SolveFingerprintResult | NightQualityResult;
export type TaskKind = TaskRequest['kind'];

export type ToWorker =
  | { readonly type: 'start'; readonly jobId: string; readonly request: TaskRequest }
  | { readonly type: 'cancel'; readonly jobId: string };

export type FromWorker =
  | { readonly type: 'progress'; readonly jobId: string; readonly done: number; readonly total: number }
  | { readonly type: 'finished'; readonly jobId: string; readonly result: TaskResult }
  | { readonly type: 'cancelled'; readonly jobId: string; readonly done: number }
  | { readonly type: 'failed'; readonly jobId: string; readonly message: string };

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

/**
 * Checks a message received by the worker; returns it typed, or a sentence saying what is wrong.
 * Only the shape is checked here; each task checks its own parameters.
 */
export function parseToWorker(message: unknown): ToWorker | string {
  if (!isRecord(message)) return `worker message must be an object, got ${typeof message}`;
  if (typeof message.jobId !== 'string' || message.jobId === '') {
    return 'worker message needs a non-empty string jobId';
  }
  if (message.type === 'cancel') return { type: 'cancel', jobId: message.jobId };
  if (message.type !== 'start') {
    return `worker message type must be "start" or "cancel", got ${JSON.stringify(message.type)}`;
  }
  const request = message.request;
  if (!isRecord(request) || typeof request.kind !== 'string') {
    return `start message for job ${message.jobId} needs a request with a kind`;
  }
  if (request.kind === 'ecliptic-field') {
    return {
      type: 'start',
      jobId: message.jobId,
      request: { kind: 'ecliptic-field', starCount: Number(request.starCount), seed: Number(request.seed) },
    };
  }
  if (request.kind === 'tonight-programme') {
    // The task checks the window; the star and site fields are checked by core as it reads them.
    return { type: 'start', jobId: message.jobId, request: request as unknown as TonightProgrammeRequest };
  }
  if ((request.kind === 'joint-solve' || request.kind === 'solve-fingerprint') && typeof request.databaseName === 'string') {
    // The task reads the model and selection as typed by the view; core checks the archive it reads.
    return { type: 'start', jobId: message.jobId, request: request as unknown as JointSolveRequest | SolveFingerprintRequest };
  }
  if (request.kind === 'night-quality') {
    if (typeof request.databaseName !== 'string') return `start message for job ${message.jobId}: night-quality needs the archive's databaseName as a string`;
    return { type: 'start', jobId: message.jobId, request: { kind: 'night-quality', databaseName: request.databaseName } };
  }
  if (isExchangeKind(request.kind) && typeof request.databaseName === 'string') {
    // Structured clone keeps the shape; each Exchange task checks its own fields as it reads them.
    return { type: 'start', jobId: message.jobId, request: request as unknown as ExchangeRequest };
  }
  return `start message for job ${message.jobId}: unknown task kind ${JSON.stringify(request.kind)}`;
}
