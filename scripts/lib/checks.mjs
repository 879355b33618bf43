// The static checks `npm test` runs before any test: formatting, changesets, lint and types.
import { log, run } from './proc.mjs';

export function staticChecks() {
  log('formatting (prettier --check)');
  run('npx', ['prettier', '--check', '--log-level=warn', '.']);
  log('changesets for calc-core and widget changes (scripts/check-changesets.mjs)');
  run('node', ['scripts/check-changesets.mjs']);
  log('lint of scripts/ and root configs (npm run lint:root)');
  run('npm', ['run', '--silent', 'lint:root']);
  log('lint and typecheck of every workspace (turbo run lint typecheck)');
  run('npx', ['turbo', 'run', 'lint', 'typecheck', '--output-logs=errors-only']);
}
