import { leadStatuses, type LeadStatus } from '@wickstone/contracts';

export const leadStatusLabel: Record<LeadStatus, string> = {
  new: 'New',
  contacted: 'Contacted',
  qualified: 'Qualified',
  closed: 'Closed',
};

export const leadStatusOptions = leadStatuses.map((s) => ({ value: s, label: leadStatusLabel[s] }));
