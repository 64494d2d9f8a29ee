/**
 * The opening most browser tests share: one Chromium for the test file and one signed-in demo
 * user (the Builder unless named), both closed after the file with its database connection.
 * Call it at the top level of the file; read `suite.browser` and `suite.builder` inside tests.
 */
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { launchBrowser } from './browser.ts';
import { signInAs, type TestUser } from './sessions.ts';
import { closeDb } from './test-db.ts';

export interface BrowserSuite {
  readonly browser: Browser;
  readonly builder: TestUser;
}

export function browserSuite(email = 'builder@wrenfield.example'): BrowserSuite {
  let browser: Browser | undefined;
  let builder: TestUser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
    builder = await signInAs(email);
  });
  afterAll(async () => {
    await browser?.close();
    await closeDb();
  });
  const ready = <T>(value: T | undefined, what: string): T => {
    if (value === undefined) throw new Error(`browserSuite: ${what} is read before beforeAll ran`);
    return value;
  };
  return {
    get browser() {
      return ready(browser, 'the browser');
    },
    get builder() {
      return ready(builder, 'the signed-in user');
    },
  };
}
