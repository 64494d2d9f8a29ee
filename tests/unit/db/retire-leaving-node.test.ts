import { describe, expect, it } from 'vitest';
import type { PoolConnection } from 'mysql2';
import { HostList, retireWhenNodeLeaves } from '~/lib/db/failover-socket.server.ts';

type Command = { onResult?: (error: unknown, ...rest: unknown[]) => unknown };

/** A stand-in for a pooled mysql2 connection: it records what it was asked to do. */
function fakeConnection() {
  const calls: string[] = [];
  const connection = {
    addCommand: (cmd: Command) => cmd,
    release: () => calls.push('release'),
    destroy: () => calls.push('destroy'),
  };
  return { connection, calls, asPool: connection as unknown as PoolConnection };
}

function run(connection: { addCommand(cmd: Command): unknown }, error: unknown): unknown[] {
  const seen: unknown[] = [];
  const cmd = connection.addCommand({ onResult: (e: unknown) => seen.push(e) }) as Command;
  cmd.onResult?.(error);
  return seen;
}

describe('retireWhenNodeLeaves: a connection to a node leaving the cluster is not pooled again', () => {
  const hosts = new HostList([{ host: '127.0.0.1', port: 1 }]);

  it('closes the connection on release after a 1047 (node outside the primary component), passing the error on', () => {
    const { connection, calls, asPool } = fakeConnection();
    retireWhenNodeLeaves(asPool, hosts);
    const refused = Object.assign(new Error('WSREP has not yet prepared node for application use'), { code: 'ER_UNKNOWN_COM_ERROR' });
    expect(run(connection, refused)).toEqual([refused]);
    connection.release();
    expect(calls).toEqual(['destroy']);
  });

  it('does the same after a 1053 (server shutting down)', () => {
    const { connection, calls, asPool } = fakeConnection();
    retireWhenNodeLeaves(asPool, hosts);
    run(connection, Object.assign(new Error('Server shutdown in progress'), { code: 'ER_SERVER_SHUTDOWN' }));
    connection.release();
    expect(calls).toEqual(['destroy']);
  });

  it('pools the connection again after a success or any other error (a duplicate key, a deadlock)', () => {
    const { connection, calls, asPool } = fakeConnection();
    retireWhenNodeLeaves(asPool, hosts);
    run(connection, null);
    run(connection, Object.assign(new Error('Duplicate entry'), { code: 'ER_DUP_ENTRY' }));
    run(connection, Object.assign(new Error('Deadlock found'), { code: 'ER_LOCK_DEADLOCK' }));
    connection.release();
    expect(calls).toEqual(['release']);
  });
});
