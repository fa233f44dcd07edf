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
  frames: '/frames',
  audit: '/audit',
  account: '/account',
  studio: '/studio',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password',
  acceptInvite: '/accept-invite',
  confirmEmail: '/confirm-email',
} as const;

export interface NavEntry {
  label: string;
  to: string;
  /** One line for screen readers and tooltips. */
  hint: string;
  /** The server permission needed to see this entry (everyone when absent). */
  permission?: string;
}

/** Settings of the signed-in person and their studio, linked from the user menu. */
export const settingsNav: readonly NavEntry[] = [
  { label: 'Account', to: paths.account, hint: 'Your name, email, password and studios' },
  {
    label: 'Studio settings',
    to: paths.studio,
    hint: 'Studio name, ownership, deletion',
    permission: 'organization:read',
  },
];

export const primaryNav: readonly NavEntry[] = [
  { label: 'Overview', to: paths.overview, hint: 'Your studio at a glance' },
  { label: 'Keys', to: paths.keys, hint: 'API keys for your apps', permission: 'keys:manage-own' },
  { label: 'Usage', to: paths.usage, hint: 'Calls made with your keys', permission: 'usage:read' },
  { label: 'Playground', to: paths.playground, hint: 'Try the lighting math' },
  { label: 'Setups', to: paths.setups, hint: 'Saved dusk setups' },
  { label: 'Test frames', to: paths.frames, hint: 'Check a test shot’s colour balance' },
  { label: 'Gear', to: paths.gear, hint: 'Lights, modifiers and gels' },
  { label: 'Team', to: paths.team, hint: 'People in your studio', permission: 'team:manage' },
  { label: 'Audit', to: paths.audit, hint: 'Who did what, and when', permission: 'audit:read' },
  { label: 'Billing', to: paths.billing, hint: 'Plan and invoices', permission: 'billing:manage' },
];
