#!/usr/bin/env node
// Entry point of the tunestrip command: the real process and file system behind main().
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { main } from './main.js';
import { nodeIo, packageRoot } from './io.js';

const version = (JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string }).version;
process.exitCode = main(process.argv.slice(2), nodeIo(), version);
