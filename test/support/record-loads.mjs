// Loaded with `node --import`: appends the URL of every module the process loads to the file named by
// SKEINPROOF_LOAD_LOG, so a test can see which compiled chunks a command pulled in.
import { register } from 'node:module';

register('./record-loads-hooks.mjs', import.meta.url, { data: { log: process.env.SKEINPROOF_LOAD_LOG } });
