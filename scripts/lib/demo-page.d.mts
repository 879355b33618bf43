export function calculatorOf(snippet: string): string | undefined;
export function demoPage(template: string, widgets: readonly { snippet: string }[]): string;
