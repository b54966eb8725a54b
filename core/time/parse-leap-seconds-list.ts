/**
 * Parser of the leap-seconds.list file published by the IERS (Paris Observatory) and distributed by
 * the IETF and the IANA time-zone database.
 *
 * Layout (described in the file's own header): data lines "NTP-seconds TAI−UTC [# comment]", where
 * NTP seconds count from 1900-01-01 0h UTC (MJD 15020) to the 0h UTC at which the new TAI − UTC
 * (whole seconds) starts; '#$' gives the last update and '#@' the expiry, both in NTP seconds;
 * '#h' gives a SHA-1 hash (five 8-digit hex words) of the digits of the '#$' value, the '#@' value
 * and the two numbers of every data line, concatenated without white space or comments (IERS,
 * leap-seconds.list "sources/README"). Other '#' lines are comments.
 *
 * The hash is checked when present; a file without one is accepted. Every malformed line is
 * rejected with its line number.
 */
import { LeapSecondTable, type LeapSecondStep } from './leap-seconds.ts';
import { sha1Hex } from './sha1.ts';

/** MJD of the NTP epoch, 1900-01-01 0h UTC. */
export const NTP_EPOCH_MJD = 15020;

/** Whole NTP seconds to a UTC MJD; throws unless the value is a whole day. */
function ntpSecondsToMjd(ntpSeconds: number, where: string): number {
  const days = ntpSeconds / 86400;
  if (!Number.isInteger(days)) {
    throw new RangeError(`${where}: NTP time ${ntpSeconds} is not at 0h UTC of a day (not a multiple of 86400 s)`);
  }
  return NTP_EPOCH_MJD + days;
}

/** Parse the text of a leap-seconds.list file; `sourceName` names it in errors and warnings. */
export function parseLeapSecondsList(text: string, sourceName: string): LeapSecondTable {
  const steps: LeapSecondStep[] = [];
  let hashInput = '';
  let updated: string | undefined;
  let expires: string | undefined;
  let statedHash: string | undefined;
  const lines = text.split(/\r?\n/);
  for (let index = 0; index < lines.length; index++) {
    const where = `${sourceName}, line ${index + 1}`;
    const line = lines[index];
    if (line.startsWith('#$')) updated = singleNumber(line, where);
    else if (line.startsWith('#@')) expires = singleNumber(line, where);
    else if (line.startsWith('#h')) statedHash = line.slice(2).trim().split(/\s+/).map((word) => word.padStart(8, '0')).join('').toLowerCase();
    else if (line.startsWith('#') || line.trim() === '') continue;
    else {
      const data = line.split('#')[0].trim().split(/\s+/);
      if (data.length !== 2 || !/^\d+$/.test(data[0]) || !/^-?\d+$/.test(data[1])) {
        throw new SyntaxError(`${where}: expected "NTP-seconds TAI-UTC" (two integers), got "${line.trim()}"`);
      }
      hashInput += data[0] + data[1];
      steps.push({
        startMjd: ntpSecondsToMjd(Number(data[0]), where),
        offsetSeconds: Number(data[1]),
        driftReferenceMjd: 0,
        driftSecondsPerDay: 0,
      });
    }
  }
  if (expires === undefined) {
    throw new SyntaxError(`${sourceName}: no '#@' expiry line; this is not a complete leap-seconds.list file`);
  }
  if (statedHash !== undefined) {
    const computed = sha1Hex((updated ?? '') + expires + hashInput);
    if (computed !== statedHash) {
      throw new SyntaxError(
        `${sourceName}: the '#h' hash ${statedHash} does not match the content (${computed}); ` +
          'the file is damaged or edited — download a fresh copy from the IERS',
      );
    }
  }
  return new LeapSecondTable(steps, {
    sourceName,
    expiresMjd: ntpSecondsToMjd(Number(expires), `${sourceName}, '#@' line`),
    updatedMjd: updated === undefined ? undefined : NTP_EPOCH_MJD + Number(updated) / 86400,
  });
}

function singleNumber(line: string, where: string): string {
  const value = line.slice(2).trim();
  if (!/^\d+$/.test(value)) throw new SyntaxError(`${where}: expected one integer of NTP seconds after '${line.slice(0, 2)}', got "${value}"`);
  return value;
}
