#!/usr/bin/env node
// Launcher for the `furrow` command: loads the TypeScript entry through tsx.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('./main.ts');
process.exitCode = await main(process.argv.slice(2));
