/** The package version the build put in (renderer/vite.config.ts), recorded as each saved solve's code version. */
export const APP_VERSION: string = __APP_VERSION__;
