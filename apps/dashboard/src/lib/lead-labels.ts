import { leadStatuses, leadStatusWords } from '@wickstone/contracts';

export const leadStatusLabel = leadStatusWords;

export const leadStatusOptions = leadStatuses.map((s) => ({ value: s, label: leadStatusLabel[s] }));
