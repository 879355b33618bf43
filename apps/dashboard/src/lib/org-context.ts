import { createContext, useContext } from 'react';
import type { Role } from '@wickstone/contracts';

export interface CurrentOrg {
  orgId: number;
  organizationName: string;
  role: Role;
  userId: number;
}

export const OrgContext = createContext<CurrentOrg | null>(null);

/** The organisation of the current `/orgs/:orgId` page; only used below the org layout. */
export function useOrg(): CurrentOrg {
  const org = useContext(OrgContext);
  if (!org) throw new Error('useOrg() used outside an organisation page');
  return org;
}
