import { ConnectionAcquireTimeoutError, ConnectionError, DatabaseError } from 'sequelize';

function original(err: unknown): { code?: string; errno?: number; message?: string } | undefined {
  return err instanceof DatabaseError ? (err as DatabaseError & { original?: { code?: string; errno?: number; message?: string } }).original : undefined;
}

/** The database is down or unreachable (the pool reconnects by itself; the client should retry later). */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (err instanceof ConnectionError || err instanceof ConnectionAcquireTimeoutError) return true;
  const o = original(err);
  return o !== undefined && /ER_SOCKET_UNEXPECTED_CLOSE|ECONNRESET|ECONNREFUSED|ER_CONNECTION|ER_GET_CONNECTION_TIMEOUT|EPIPE/.test(`${o.code ?? ''} ${o.message ?? ''}`);
}

/**
 * The database refused a transaction because of a simultaneous one: a deadlock (1213), a lock wait that timed out
 * (1205), or — on a Galera cluster — a certification conflict, which Galera reports as a deadlock. Nothing of the
 * transaction was kept; the client may simply retry.
 */
export function isConcurrentChange(err: unknown): boolean {
  const o = original(err);
  return o !== undefined && (o.errno === 1213 || o.errno === 1205 || /ER_LOCK_DEADLOCK|ER_LOCK_WAIT_TIMEOUT/.test(o.code ?? ''));
}
