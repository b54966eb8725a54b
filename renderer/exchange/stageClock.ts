/**
 * Wall-clock milliseconds of the stages of one long Exchange task (read, parse, plan, write …),
 * written to the console at debug level when the task ends, so that a slow import can be profiled
 * in the field and by `npm run bench:import` without a tracing tool. Costs one performance.now()
 * per stage.
 */
export class StageClock {
  readonly #task: string;
  readonly #stages: [string, number][] = [];
  #last = performance.now();

  constructor(task: string) {
    this.#task = task;
  }

  /** Ends the current stage under `name` and starts the next one; a name used again adds to its stage (a loop's parts). */
  lap(name: string): void {
    const now = performance.now();
    const stage = this.#stages.find(([known]) => known === name);
    if (stage === undefined) this.#stages.push([name, now - this.#last]);
    else stage[1] += now - this.#last;
    this.#last = now;
  }

  /** One line, e.g. `[exchange] import of log.csv, stages in ms: parse 812, plan 95, write 30211`. */
  report(): string {
    return `[exchange] ${this.#task}, stages in ms: ${this.#stages.map(([name, ms]) => `${name} ${ms.toFixed(0)}`).join(', ')}`;
  }

  log(): void {
    console.debug(this.report());
  }
}
