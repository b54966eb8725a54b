/** The current instant as an ISO 8601 UTC string (`2026-12-01T22:45:29.123Z`), for audit stamps. */
export function nowUtcIso(): string {
  return new Date().toISOString();
}
