// Eight real lines of the IERS Rapid Service finals2000A file (2016-04-25 … 2016-05-02, issued
// 2016-04-30; as carried by Debian's python3-astropy test data): Bulletin A values, 'I' (observed)
// then 'P' (predicted) flags. Shared by the tests of the Earth orientation tables.
export const FINALS_2016_LINES = [
  '16 425 57503.00 I  0.027084 0.000091  0.463531 0.000093  I-0.1265278 0.0000165  1.3290 0.0090  P     0.013    0.239     0.007    0.600',
  '16 426 57504.00 I  0.028086 0.000091  0.465338 0.000093  I-0.1278231 0.0000161  1.2593 0.0118  P     0.040    0.239     0.003    0.600',
  '16 427 57505.00 I  0.028928 0.000091  0.467015 0.000092  I-0.1290372 0.0000169  1.1618 0.0123  P     0.065    0.239     0.008    0.600',
  '16 428 57506.00 I  0.029730 0.000092  0.468564 0.000091  I-0.1303716 0.0000185                 P     0.083    0.239     0.035    0.600',
  '16 429 57507.00 P  0.030798 0.000622  0.469783 0.000448  P-0.1317429 0.0001080                 P     0.085    0.239     0.066    0.600',
  '16 430 57508.00 P  0.031994 0.000923  0.470993 0.000737  P-0.1331878 0.0002041                 P     0.065    0.239     0.057    0.600',
  '16 5 1 57509.00 P  0.033490 0.001163  0.472083 0.000987  P-0.1347405 0.0003028                 P     0.040    0.239     0.007    0.600',
  '16 5 2 57510.00 P  0.035183 0.001370  0.473116 0.001215  P-0.1364495 0.0004021                 P     0.034    0.239    -0.028    0.600',
] as const;

/** The excerpt's lines for MJD first … last (within 57503 … 57510) as file text. */
export function finals2016(firstMjd = 57503, lastMjd = 57510): string {
  return `${FINALS_2016_LINES.slice(firstMjd - 57503, lastMjd - 57503 + 1).join('\n')}\n`;
}

/**
 * The excerpt's lines moved on by `days` (date and MJD fields rewritten, values kept): a structural
 * check of dates the real excerpt does not cover, never a source of real values for those dates.
 */
export function finalsMoved(days: number, firstMjd = 57503, lastMjd = 57510): string {
  return finals2016(firstMjd, lastMjd).split('\n').filter((l) => l !== '').map((line) => {
    const mjd = Number(line.slice(7, 15)) + days;
    const date = new Date(Date.UTC(1858, 10, 17) + mjd * 86_400_000);
    const yy = String(date.getUTCFullYear() % 100).padStart(2, '0');
    const head = `${yy}${String(date.getUTCMonth() + 1).padStart(2, ' ')}${String(date.getUTCDate()).padStart(2, ' ')} ${mjd.toFixed(2).padStart(8, ' ')}`;
    return head + line.slice(15);
  }).join('\n') + '\n';
}
