/** A small outlined link that sits beside buttons in setup rows and cards. */
export const actionLink =
  'inline-flex rounded-control border border-edge-strong px-2 py-1 text-small font-medium text-ink no-underline hover:bg-raised';
