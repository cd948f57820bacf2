/**
 * Kit loans of the demo with their full history: one loan per completed walkthrough and two other
 * past loans (returned and inspected), a cancelled and a declined request, one kit in use now and
 * one requested for the planned walkthrough. No two loans that hold a kit overlap (the database
 * refuses that), and no instrument of a holding loan is past calibration on its days.
 */
import { dayToIso, isoToDay } from './dates';
import { demoUuid } from './field-ids';
import type { DemoLoan, DemoWalkthrough } from './field-types';
import type { Rng } from './prng';
import { at, AUDITOR, STAFF_BNP, STAFF_KSL, STAFF_SBP } from './walkthroughs';

export const CUSTODIAN = 'custodian@demo.plumbline.test';
const STAFF_DMF = 'amara.quist@demo.plumbline.test';
const STAFF_FHS = 'lev.sandoval@demo.plumbline.test';

type Step = readonly [DemoLoan['status'], string, number, string, string];

/** A loan and its events; each step is [status, by, day, hh:mm, note], in order. */
function loan(rng: Rng, base: Omit<DemoLoan, 'id' | 'events' | 'status'>, steps: readonly Step[]): DemoLoan {
  const events = steps.map(([toStatus, by, day, hhmm, note], i) => ({ fromStatus: i === 0 ? null : steps[i - 1]![0], toStatus, by, note, at: at(day, hhmm) }));
  return { id: demoUuid(rng), ...base, status: steps[steps.length - 1]![0], events };
}

/** The usual life of a loan that went out and came back: requested → … → inspected. */
function completedSteps(requester: string, user: string, start: number, end: number): Step[] {
  return [
    ['requested', requester, start - 20, '09:10', ''],
    ['approved', CUSTODIAN, start - 18, '11:40', ''],
    ['shipped', CUSTODIAN, start - 3, '15:20', 'Sent by interoffice courier.'],
    ['in-use', user, start, '08:05', 'Received; all instruments present.'],
    ['returned', user, end + 1, '16:30', ''],
    ['inspected', CUSTODIAN, end + 4, '10:00', 'Complete and clean; batteries replaced.'],
  ];
}

export function demoLoans(rng: Rng, today: number, walkthroughs: readonly DemoWalkthrough[]): DemoLoan[] {
  const byBuilding = (code: string, number: string) => {
    const w = walkthroughs.find((x) => x.installationCode === code && x.buildingNumber === number);
    if (!w) throw new Error(`no demo walkthrough at ${code} ${number}`);
    return w;
  };
  const forWalkthrough = (w: DemoWalkthrough, kitCode: string, requester: string, purpose: string): DemoLoan => {
    const day = isoToDay(w.plannedOn);
    return loan(rng, { kitCode, installationCode: w.installationCode, walkthroughId: w.id, requestedBy: requester, purpose, startDate: dayToIso(day - 1), endDate: dayToIso(day + 1) }, completedSteps(requester, w.auditor, day - 1, day + 1));
  };
  const planned = walkthroughs.find((w) => w.status === 'planned');
  if (!planned) throw new Error('no planned demo walkthrough');
  const plannedDay = isoToDay(planned.plannedOn);
  return [
    forWalkthrough(byBuilding('BNP', '3102'), 'KIT-02', STAFF_BNP, 'Walkthrough of BNP 3102 Corrigan Hall: combustion test of the boilers'),
    forWalkthrough(byBuilding('SBP', '2301'), 'KIT-03', STAFF_SBP, 'Walkthrough of SBP 2301 Bayside Dining Facility: flow tests in the kitchen'),
    forWalkthrough(byBuilding('BNP', '3204'), 'KIT-01', STAFF_BNP, 'Walkthrough of BNP 3204 Brennock Operations Center: plug loads and lighting hours'),
    loan(rng, { kitCode: 'KIT-04', installationCode: 'DMF', walkthroughId: null, requestedBy: STAFF_DMF, purpose: 'Three-phase logging of the new simulators at DMF 1650', startDate: dayToIso(today - 150), endDate: dayToIso(today - 137) }, completedSteps(STAFF_DMF, STAFF_DMF, today - 150, today - 137)),
    loan(rng, { kitCode: 'KIT-05', installationCode: 'FHS', walkthroughId: null, requestedBy: STAFF_FHS, purpose: 'CO₂ and comfort logging in two training buildings', startDate: dayToIso(today - 240), endDate: dayToIso(today - 227) }, completedSteps(STAFF_FHS, STAFF_FHS, today - 240, today - 227)),
    loan(rng, { kitCode: 'KIT-02', installationCode: 'KSL', walkthroughId: null, requestedBy: STAFF_KSL, purpose: 'Boiler check at KSL before the heating season', startDate: dayToIso(today - 300), endDate: dayToIso(today - 296) }, [
      ['requested', STAFF_KSL, today - 320, '13:00', ''],
      ['cancelled', STAFF_KSL, today - 310, '08:45', 'Plant contractor on site those days; will ask again.'],
    ]),
    loan(rng, { kitCode: 'KIT-05', installationCode: 'SBP', walkthroughId: null, requestedBy: STAFF_SBP, purpose: 'Humidity logging in the dining facility', startDate: dayToIso(today - 235), endDate: dayToIso(today - 229) }, [
      ['requested', STAFF_SBP, today - 262, '10:30', ''],
      ['declined', CUSTODIAN, today - 261, '09:15', 'Promised to FHS for those dates; the heating plant kit has four temperature/humidity loggers.'],
    ]),
    loan(rng, { kitCode: 'KIT-01', installationCode: 'BNP', walkthroughId: null, requestedBy: STAFF_BNP, purpose: 'Night-time base-load logging at BNP 3204 before the next walkthrough', startDate: dayToIso(today - 3), endDate: dayToIso(today + 4) }, [
      ['requested', STAFF_BNP, today - 12, '09:00', ''],
      ['approved', CUSTODIAN, today - 11, '10:20', ''],
      ['shipped', CUSTODIAN, today - 4, '14:10', 'Hand-carried.'],
      ['in-use', STAFF_BNP, today - 3, '08:30', 'Loggers placed on floors 1–3 and at the server rack feed.'],
    ]),
    loan(rng, { kitCode: 'KIT-02', installationCode: planned.installationCode, walkthroughId: planned.id, requestedBy: AUDITOR, purpose: 'Walkthrough of KSL 415 Harwood Hall: combustion test and infrared survey', startDate: dayToIso(plannedDay - 1), endDate: dayToIso(plannedDay + 1) }, [
      ['requested', AUDITOR, today - 5, '10:40', ''],
    ]),
  ];
}
