/** The calc-core release; every result carries it so a logged run can be re-run on the same code. */
export const VERSION = '0.3.0';
