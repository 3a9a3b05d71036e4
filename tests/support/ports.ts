import { createHash } from 'node:crypto';
import { resolve } from 'node:path';

/**
 * A port for a test server, fixed for this checkout and different between
 * checkouts, so that test runs in two working copies on one machine do not
 * take each other's port. `slot` separates the servers of one checkout.
 */
export function checkoutPort(slot: number): number {
  const root = resolve(import.meta.dirname, '../..');
  const h = createHash('sha256').update(root).digest().readUInt16BE(0);
  return 20000 + (h % 2000) * 10 + slot;
}
