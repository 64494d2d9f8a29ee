import { createServer, type Server } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { FailoverSocket, HOST_DOWN_MS, HostList } from '~/lib/db/failover-socket.server.ts';
import { freePort } from '../../support/free-port.ts';

const h = (port: number) => ({ host: '127.0.0.1', port });

describe('HostList: the order a new connection tries the cluster nodes in', () => {
  it('is the listed order, with hosts seen down lately at the end until their time is up', () => {
    let now = 1_000;
    const list = new HostList([h(1), h(2), h(3)], () => now);
    expect(list.order()).toEqual([h(1), h(2), h(3)]);
    list.markDown(h(1));
    expect(list.order()).toEqual([h(2), h(3), h(1)]);
    now += HOST_DOWN_MS;
    expect(list.order()).toEqual([h(1), h(2), h(3)]);
  });
});

describe('FailoverSocket', () => {
  const servers: Server[] = [];
  afterEach(() => servers.splice(0).forEach((s) => s.close()));

  /** A server that greets with `name`, as a database server speaks first. */
  async function greeter(name: string): Promise<number> {
    const port = await freePort();
    const server = createServer((socket) => socket.end(name));
    servers.push(server);
    await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
    return port;
  }

  const read = (socket: FailoverSocket) =>
    new Promise<string>((resolve, reject) => {
      let text = '';
      socket.on('data', (chunk: Buffer) => (text += chunk.toString()));
      socket.on('end', () => resolve(text));
      socket.on('error', reject);
    });

  it('reaches the first host that accepts, skipping one that refuses, and marks the refuser down', async () => {
    const closed = await freePort();
    const up = await greeter('node two');
    const list = new HostList([h(closed), h(up)]);
    const socket = new FailoverSocket(list, 1000);
    expect(await read(socket)).toBe('node two');
    expect(socket.connectedTo).toEqual(h(up));
    expect(list.order()[0]).toEqual(h(up));
  });

  it('fails as "connection refused" (an outage, 503) when no host accepts', async () => {
    const list = new HostList([h(await freePort()), h(await freePort())]);
    await expect(read(new FailoverSocket(list, 1000))).rejects.toMatchObject({ code: 'ECONNREFUSED' });
  });
});
