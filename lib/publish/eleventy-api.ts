/**
 * The part of Eleventy 3's programmatic API that cellbasis uses, typed here (Eleventy ships no
 * TypeScript declarations): the Eleventy class for builds and the dev server, and the
 * configuration object the site's configuration (eleventy-config.ts) receives.
 */
import { Eleventy as EleventyClass } from '@11ty/eleventy';

export interface EleventyConfig {
  setInputDirectory(dir: string): void;
  setIncludesDirectory(dir: string): void;
  setOutputDirectory(dir: string): void;
  setTemplateFormats(formats: string[]): void;
  setLibrary(name: 'njk', library: unknown): void;
  addGlobalData(name: string, data: unknown): void;
  addPassthroughCopy(copy: Record<string, string>): void;
  addWatchTarget(target: string): void;
  setServerOptions(options: Record<string, unknown>): void;
  setQuietMode(quiet: boolean): void;
  /** Eleventy's events; 'eleventy.before' is awaited before a build writes anything. */
  on(event: 'eleventy.before', listener: (args: { directories: { output: string }; outputMode: string }) => void | Promise<void>): void;
}

export interface EleventyRunner {
  init(): Promise<unknown>;
  write(): Promise<unknown>;
  watch(): Promise<unknown>;
  serve(port?: number): Promise<unknown>;
  stopWatch(): Promise<unknown>;
  disableLogger(): void;
}

export interface EleventyOptions {
  configPath: string;
  quietMode?: boolean;
  runMode?: 'build' | 'serve' | 'watch';
  /** The module system of the configuration; ours is ESM whatever the working folder's package.json says. */
  loader?: 'esm' | 'cjs' | 'auto';
}

export function createEleventy(input: string, output: string, options: EleventyOptions): EleventyRunner {
  const Eleventy = EleventyClass as unknown as new (input: string, output: string, options: EleventyOptions) => EleventyRunner;
  return new Eleventy(input, output, { loader: 'esm', ...options });
}
