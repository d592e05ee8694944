#!/usr/bin/env node
// Bootstrap: compile the TypeScript CLI on the fly (tsx), then hand over to main.ts.
require('tsx/cjs/api').register();
require('./main.ts').runCli(process.argv.slice(2));
