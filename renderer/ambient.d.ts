// Plain `tsc` (unit/tsconfig.json checks renderer/**/*.ts too) needs the rune declarations and a
// module type for `.svelte` files; svelte-check resolves the real components and ignores this.
/// <reference types="svelte" />
/// <reference types="vite/client" />

/** The package version, put in by renderer/vite.config.ts at build time. */
declare const __APP_VERSION__: string;
/** An identity of this build's code (renderer/vite.config.ts buildId). */
declare const __BUILD_ID__: string;
