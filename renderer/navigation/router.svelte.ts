import { DEFAULT_VIEW, hashForView, viewFromHash, type ViewId } from './views.ts';

/** The part of `window` the router needs; tests pass their own. */
export interface HashHost {
  readonly location: { hash: string };
  addEventListener(type: 'hashchange', listener: () => void): void;
}

/**
 * Which view is shown, kept in the location hash so a reload (or the Back button) keeps it.
 * An unknown hash shows the default view and is rewritten, so the address bar never lies.
 */
export class ViewRouter {
  current = $state<ViewId>(DEFAULT_VIEW);
  readonly #host: HashHost;

  constructor(host: HashHost) {
    this.#host = host;
    this.#sync();
    host.addEventListener('hashchange', () => this.#sync());
  }

  go(view: ViewId): void {
    this.current = view;
    const hash = hashForView(view);
    if (this.#host.location.hash !== hash) this.#host.location.hash = hash;
  }

  #sync(): void {
    const view = viewFromHash(this.#host.location.hash);
    if (view === null) this.go(DEFAULT_VIEW);
    else this.current = view;
  }
}
