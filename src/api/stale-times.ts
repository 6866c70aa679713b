/** How long each kind of data counts as fresh, in milliseconds. Named so screens agree. */
export const staleTimes = {
  /** Who is signed in; changes only through our own mutations, which update it directly. */
  session: 5 * 60_000,
  /** Team members and invitations; others may change them, so refresh fairly often. */
  team: 30_000,
  /** Caught development mail arrives at any time. */
  devMail: 0,
  /** Site list. */
  sites: 60_000,
  /** The surface register: others record and close entries during a plant walk. */
  register: 15_000,
  /** A single invitation preview. */
  invitation: 60_000,
} as const;
