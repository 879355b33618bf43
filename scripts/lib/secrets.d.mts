export function ensureSessionSecret(varDir: string): string;
