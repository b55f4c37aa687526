/**
 * The pages of one browser context that prints run on: at most `size` at once, a print waiting
 * for a free page, a page that failed closed and replaced.
 */
import type { BrowserContext, Page } from 'playwright-core';

/** At most `size` pages; a print waits for a free one. */
export class PagePool {
  private readonly idle: Page[] = [];
  private readonly waiting: { resolve: (page: Page) => void; reject: (error: unknown) => void }[] = [];
  private created = 0;

  constructor(
    private readonly context: BrowserContext,
    private readonly size: number,
  ) {}

  private async create(): Promise<Page> {
    this.created += 1;
    try {
      return await this.context.newPage();
    } catch (error) {
      this.created -= 1;
      throw error;
    }
  }

  acquire(): Promise<Page> {
    const idle = this.idle.pop();
    if (idle) return Promise.resolve(idle);
    if (this.created < this.size) return this.create();
    return new Promise((resolve, reject) => this.waiting.push({ resolve, reject }));
  }

  release(page: Page): void {
    const next = this.waiting.shift();
    if (next) next.resolve(page);
    else this.idle.push(page);
  }

  /** A page that failed is closed; whoever waits gets a fresh one. */
  async discard(page: Page): Promise<void> {
    this.created -= 1;
    await page.close().catch(() => undefined);
    const next = this.waiting.shift();
    if (next) this.create().then(next.resolve, next.reject);
  }
}

