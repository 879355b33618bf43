// Standard gravity on its own: the units table derives the pound-force from it and the formulas
// use it, and neither may import the other's module (a bundle may swap the table, see unit-table.ts).

/** Standard acceleration of gravity gₙ in m/s² (exact, CGPM 1901; NIST SP 811). */
export const STANDARD_GRAVITY = 9.80665;
