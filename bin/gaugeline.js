#!/usr/bin/env node
// Shim: lets `npx gaugeline` run the TypeScript CLI directly through tsx.
import { register } from 'tsx/esm/api';

register();
await import(new URL('../server/cli/main.ts', import.meta.url).href);
