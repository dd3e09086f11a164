/** Query keys of the auth feature. */
export const authKeys = {
  all: ['auth'] as const,
  session: () => [...authKeys.all, 'session'] as const,
  /** Set (true) when the user signed out on purpose, so sign-in does not send them back where they were. */
  signedOut: () => [...authKeys.all, 'signed-out'] as const,
};
