/** The invented demo desk and its sign-ins, printed by `npm start`. */
export const DEMO_DESK = 'Larkspur Index Volatility';

export const DEMO_USERS = [
  {
    email: 'lead@larkspur.test',
    name: 'Mira Castellan',
    role: 'lead',
    password: 'larkspur-lead-1',
  },
  {
    email: 'trader@larkspur.test',
    name: 'Jonas Okafor',
    role: 'trader',
    password: 'larkspur-trader-1',
  },
  {
    email: 'analyst@larkspur.test',
    name: 'Aiko Brandt',
    role: 'analyst',
    password: 'larkspur-analyst-1',
  },
] as const;

/** The desk's shared scenario sets (fixed ids, so a re-seeded desk keeps them). */
export const DEMO_SETS = [
  {
    name: 'LKX 40 weekly stresses',
    scenarios: [
      {
        id: 'b7c1a8e0-3f52-4f4e-8d11-5a0f3c9e2b01',
        name: 'LKX 40 — gap week',
        notes: 'Shared by the desk lead: jumps three times as often, 5 points more negative.',
        stress: { jumpIntensityScale: 3, jumpMeanShift: -0.05 },
      },
      {
        id: 'b7c1a8e0-3f52-4f4e-8d11-5a0f3c9e2b02',
        name: 'LKX 40 — quiet week',
        notes: 'Shared by the desk lead: half the jump intensity, vol of vol 20 % lower.',
        stress: { jumpIntensityScale: 0.5, volOfVolScale: 0.8 },
      },
    ],
  },
  {
    name: 'LKX 40 open-gap ladder',
    scenarios: [
      {
        id: 'b7c1a8e0-3f52-4f4e-8d11-5a0f3c9e2b03',
        name: 'LKX 40 — 8 % open gap',
        notes: 'Shared by the desk lead: spot 8 % lower at the open, vol of vol up half.',
        stress: { spotShift: -0.08, volOfVolScale: 1.5 },
      },
    ],
  },
] as const;

/** The desk's shared book, kept in the first demo set and revalued under its scenarios. */
export const DEMO_DESK_BOOK = {
  id: 'b7c1a8e0-3f52-4f4e-8d11-5a0f3c9e2b10',
  name: 'LKX 40 short end (desk)',
  setName: DEMO_SETS[0].name,
  /** index options: 10 units of the index per contract, booked in euros */
  multiplier: 10,
  currency: 'EUR',
} as const;
