#!/usr/bin/env node
// Entry point of `npx straddle`: registers the TypeScript loader, then runs the CLI.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2), process.stdout, process.stderr);
