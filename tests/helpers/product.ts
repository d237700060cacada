import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { projectRoot } from '../../backend/paths';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export interface RunningProduct {
  url: string;
  /** Everything the product printed so far (stdout and stderr), e.g. development's mail links. */
  readonly output: string;
  stop: () => Promise<void>;
}

/** This process's environment less what the test runner added (NODE_ENV, VITEST…). */
export function personEnv(): NodeJS.ProcessEnv {
  const env = { ...process.env };
  for (const name of Object.keys(env))
    if (name === 'NODE_ENV' || name.startsWith('VITEST') || name === 'TEST') delete env[name];
  return env;
}

/**
 * Starts the product exactly as a person does (`npm start`), on a free port and a fresh database
 * file, and resolves with its URL once it prints it.
 */
export async function startProduct(): Promise<RunningProduct> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'conductory-e2e-'));
  const child: ChildProcess = spawn('npm', ['start'], {
    cwd: projectRoot,
    // The environment a person has: theirs, with no NODE_ENV (vitest sets it to 'test').
    env: {
      ...personEnv(),
      PORT: '0',
      HOST: '127.0.0.1',
      DATABASE_FILE: path.join(dataDir, 'e2e.sqlite'),
      LOG_LEVEL: 'warn',
    },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(
      () => reject(new Error(`npm start printed no URL within 120 s:\n${output}`)),
      120_000,
    );
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      const m = output.match(/serving on (http:\/\/[\d.]+:\d+)\//);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]!);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`npm start exited with ${code}:\n${output}`));
    });
  });
  return {
    url,
    get output() {
      return output;
    },
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        process.kill(-child.pid!, 'SIGTERM');
        await exited;
      }
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Debian's Chromium, headless, with the flags this machine needs (stack.md). Fails loudly if absent. */
export async function launchChromium(): Promise<Browser> {
  if (!fs.existsSync(CHROMIUM)) {
    throw new Error(
      `Chromium is not installed at ${CHROMIUM}: the browser tests need it. Install it with 'apt-get install -y chromium' (or set CHROMIUM_PATH).`,
    );
  }
  return chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export const screenshotDir = path.join(projectRoot, 'test-results');
fs.mkdirSync(screenshotDir, { recursive: true });
export const shot = (name: string) => path.join(screenshotDir, `${name}.png`);

export interface BrowserSession {
  readonly url: string;
  readonly page: import('playwright-core').Page;
  /** Uncaught errors the page raised so far. */
  readonly pageErrors: string[];
}

/**
 * Registers beforeAll/afterAll hooks that start the product with `npm start` and open one
 * Chromium page on it; the returned object is usable inside the tests.
 */
export function browserSession(
  hooks: {
    beforeAll: typeof import('vitest').beforeAll;
    afterAll: typeof import('vitest').afterAll;
  },
  viewport = { width: 1280, height: 900 },
): BrowserSession {
  let product: RunningProduct | undefined;
  let browser: Browser | undefined;
  let page: import('playwright-core').Page | undefined;
  const pageErrors: string[] = [];
  hooks.beforeAll(async () => {
    browser = await launchChromium();
    product = await startProduct();
    page = await browser.newPage({ viewport });
    page.on('pageerror', (e) => pageErrors.push(e.message));
  }, 180_000);
  hooks.afterAll(async () => {
    await browser?.close();
    await product?.stop();
  });
  return {
    get url() {
      return product!.url;
    },
    get page() {
      return page!;
    },
    pageErrors,
  };
}
