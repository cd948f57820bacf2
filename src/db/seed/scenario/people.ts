/**
 * Demo accounts: one per role at @demo.plumbline.test (password in docs/demo-scenario.md), plus
 * installation staff for the other installations. All names are invented. An empty
 * installationCodes list means the role is not scoped to installations.
 */
import type { DemoPerson } from './types';

export const DEMO_EMAIL_DOMAIN = 'demo.plumbline.test';

export function demoPeople(): DemoPerson[] {
  const at = (local: string): string => `${local}@${DEMO_EMAIL_DOMAIN}`;
  return [
    { email: at('admin'), name: 'Rowan Achterberg', role: 'admin', installationCodes: [] },
    { email: at('manager'), name: 'Teodora Vasquez-Lund', role: 'regional_manager', installationCodes: [] },
    { email: at('staff'), name: 'Callum Brightwater', role: 'installation_staff', installationCodes: ['BNP'] },
    { email: at('analyst'), name: 'Priya Halloran', role: 'analyst', installationCodes: [] },
    { email: at('auditor'), name: 'Mateo Lindqvist', role: 'auditor', installationCodes: ['BNP', 'KSL'] },
    { email: at('custodian'), name: 'Odile Fairbanks', role: 'kit_custodian', installationCodes: [] },
    { email: at('ines.varga'), name: 'Ines Varga', role: 'installation_staff', installationCodes: ['KSL'] },
    { email: at('tobias.renner'), name: 'Tobias Renner', role: 'installation_staff', installationCodes: ['SBP'] },
    { email: at('amara.quist'), name: 'Amara Quist', role: 'installation_staff', installationCodes: ['DMF'] },
    { email: at('lev.sandoval'), name: 'Lev Sandoval', role: 'installation_staff', installationCodes: ['FHS'] },
  ];
}
