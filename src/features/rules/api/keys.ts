/** Query keys of clearance rules. */
export const ruleKeys = {
  all: ['rules'] as const,
  lists: () => [...ruleKeys.all, 'list'] as const,
  list: (projectId: number) => [...ruleKeys.lists(), projectId] as const,
};
