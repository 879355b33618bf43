import { readFileSync } from 'node:fs';

// src/ and dist/ both sit one level below package.json, so the same relative URL works for both.
const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as {
  version: string;
};

export const serverVersion: string = pkg.version;
