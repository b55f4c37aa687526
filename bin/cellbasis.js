#!/usr/bin/env node
// Entry point of the cellbasis command. The library is TypeScript, run through tsx's loader.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../lib/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
