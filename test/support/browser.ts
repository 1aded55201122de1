import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Readable, Writable } from 'node:stream';

/** Chromium from Debian (package chromium, installed by .ci/run), or TREEBRIDGE_CHROMIUM. */
export const chromium = process.env.TREEBRIDGE_CHROMIUM ?? '/usr/bin/chromium';

interface Message {
  id?: number;
  method?: string;
  params?: Record<string, unknown>;
  result?: Record<string, unknown>;
  error?: { message: string };
  sessionId?: string;
}

/**
 * Headless Chromium driven through its DevTools protocol over a pipe
 * (--remote-debugging-pipe: JSON messages ended by NUL on file descriptors 3
 * and 4), so that a test can load a page, run checks in it, scroll and take
 * real screenshots, and hear every console message and uncaught error.
 */
export class Browser {
  private next = 1;
  private readonly waiting = new Map<number, { resolve: (result: Record<string, unknown>) => void; reject: (error: Error) => void }>();
  private readonly listeners: Array<(message: Message) => void> = [];
  private buffer = '';

  private constructor(private readonly child: ChildProcess) {
    const input = child.stdio[4] as Readable;
    input.setEncoding('utf8');
    input.on('data', (chunk: string) => {
      this.buffer += chunk;
      let end;
      while ((end = this.buffer.indexOf('\0')) !== -1) {
        const message = JSON.parse(this.buffer.slice(0, end)) as Message;
        this.buffer = this.buffer.slice(end + 1);
        if (message.id !== undefined && this.waiting.has(message.id)) {
          const { resolve, reject } = this.waiting.get(message.id)!;
          this.waiting.delete(message.id);
          if (message.error) reject(new Error(message.error.message));
          else resolve(message.result ?? {});
        } else for (const listener of this.listeners) listener(message);
      }
    });
  }

  static launch(): Browser {
    const profile = mkdtempSync(join(tmpdir(), 'treebridge-chromium-'));
    const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--hide-scrollbars'];
    const child = spawn(chromium, [...flags, `--user-data-dir=${profile}`, '--remote-debugging-pipe', 'about:blank'], { stdio: ['ignore', 'ignore', 'ignore', 'pipe', 'pipe'] });
    return new Browser(child);
  }

  send(method: string, params: Record<string, unknown> = {}, sessionId?: string): Promise<Record<string, unknown>> {
    const id = this.next++;
    const message: Message = { id, method, params };
    if (sessionId) message.sessionId = sessionId;
    return new Promise((resolve, reject) => {
      this.waiting.set(id, { resolve, reject });
      (this.child.stdio[3] as Writable).write(JSON.stringify(message) + '\0');
    });
  }

  on(listener: (message: Message) => void): void {
    this.listeners.push(listener);
  }

  /** Opens a page at `url` (a viewport of width × height) and waits for its load event; gives the page and the milliseconds it took. */
  async open(url: string, width = 1400, height = 1000): Promise<{ page: Page; loadMs: number }> {
    const { targetId } = (await this.send('Target.createTarget', { url: 'about:blank' })) as { targetId: string };
    const { sessionId } = (await this.send('Target.attachToTarget', { targetId, flatten: true })) as { sessionId: string };
    const page = new Page(this, sessionId);
    this.on((message) => {
      if (message.sessionId !== sessionId) return;
      if (message.method === 'Runtime.consoleAPICalled') page.console.push(JSON.stringify(message.params?.args));
      if (message.method === 'Runtime.exceptionThrown') page.console.push(JSON.stringify(message.params?.exceptionDetails));
      if (message.method === 'Log.entryAdded') page.console.push(JSON.stringify(message.params?.entry));
    });
    await this.send('Runtime.enable', {}, sessionId);
    await this.send('Log.enable', {}, sessionId);
    await this.send('Page.enable', {}, sessionId);
    await this.send('Emulation.setDeviceMetricsOverride', { width, height, deviceScaleFactor: 1, mobile: false }, sessionId);
    const loaded = new Promise<void>((resolve) => this.on((message) => message.sessionId === sessionId && message.method === 'Page.loadEventFired' && resolve()));
    const started = performance.now();
    await this.send('Page.navigate', { url }, sessionId);
    await loaded;
    return { page, loadMs: performance.now() - started };
  }

  close(): void {
    this.child.kill();
  }
}

export class Page {
  /** Console messages, log entries and uncaught errors of the page. */
  readonly console: string[] = [];

  constructor(
    private readonly browser: Browser,
    private readonly sessionId: string,
  ) {}

  async evaluate<T>(expression: string): Promise<T> {
    const { result, exceptionDetails } = (await this.browser.send('Runtime.evaluate', { expression, returnByValue: true }, this.sessionId)) as {
      result: { value: T };
      exceptionDetails?: unknown;
    };
    if (exceptionDetails) throw new Error(`page script failed: ${JSON.stringify(exceptionDetails)}`);
    return result.value;
  }

  /** A screenshot of what the viewport shows now, written to `path` as PNG; gives its size in bytes. */
  async screenshot(path: string): Promise<number> {
    const { data } = (await this.browser.send('Page.captureScreenshot', { format: 'png' }, this.sessionId)) as { data: string };
    const bytes = Buffer.from(data, 'base64');
    writeFileSync(path, bytes);
    return bytes.length;
  }
}
