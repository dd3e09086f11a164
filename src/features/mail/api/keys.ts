/** Query keys of mail: the administrator's view of the outbox and the development catcher. */
export const mailKeys = {
  all: ['mail'] as const,
  admin: () => [...mailKeys.all, 'admin'] as const,
  captured: (id: number) => [...mailKeys.all, 'captured', id] as const,
};
