/**
 * The local outbox: the fake SMTP server writes each received message here as JSON, and the
 * development Outbox page and the tests read it back. Never used with a real mail service.
 */
import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';

export interface OutboxMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

export async function saveToOutbox(dir: string, message: OutboxMessage): Promise<void> {
  await mkdir(dir, { recursive: true });
  await writeFile(join(dir, `${message.id}.json`), JSON.stringify(message, null, 2));
}

/** Newest first. A missing directory is an empty outbox. */
export async function readOutbox(dir: string): Promise<OutboxMessage[]> {
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  const messages = await Promise.all(
    names.map(async (n) => JSON.parse(await readFile(join(dir, n), 'utf8')) as OutboxMessage),
  );
  return messages.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id));
}
