/** The absolute path of the Electron executable, or null when its binary is not installed. */
export function electronBinaryPath(): string | null;
