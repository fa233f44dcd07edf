/** Every route's path in one place; links and the router both read from here. */
export const paths = {
  overview: '/',
  keys: '/keys',
  usage: '/usage',
  playground: '/playground',
  setups: '/setups',
  gear: '/gear',
  team: '/team',
  billing: '/billing',
  signIn: '/sign-in',
  signUp: '/sign-up',
} as const;

export interface NavEntry {
  label: string;
  to: string;
  /** One line for screen readers and tooltips. */
  hint: string;
}

export const primaryNav: readonly NavEntry[] = [
  { label: 'Overview', to: paths.overview, hint: 'Your studio at a glance' },
  { label: 'Keys', to: paths.keys, hint: 'API keys for your apps' },
  { label: 'Usage', to: paths.usage, hint: 'Calls made with your keys' },
  { label: 'Playground', to: paths.playground, hint: 'Try the lighting math' },
  { label: 'Setups', to: paths.setups, hint: 'Saved dusk setups' },
  { label: 'Gear', to: paths.gear, hint: 'Lights, modifiers and gels' },
  { label: 'Team', to: paths.team, hint: 'People in your studio' },
  { label: 'Billing', to: paths.billing, hint: 'Plan and invoices' },
];
