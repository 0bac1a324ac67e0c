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
