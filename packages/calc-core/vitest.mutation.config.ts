import { defineConfig } from 'vitest/config';

// Mutation testing (npm run mutation): the mutated folders are src/formulas, src/properties and
// src/units.ts, and their own unit tests are what must kill the mutants. The calculator-level
// property sweeps would run for every mutant and make a run take hours on this machine.
export default defineConfig({
  test: {
    name: 'calc-core-mutation',
    include: ['src/formulas/**/*.test.ts', 'src/properties/**/*.test.ts', 'src/units.test.ts'],
  },
});
