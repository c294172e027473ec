/** Role names as people read them; the API uses the keys. */
export const roleLabels = {
	admin: 'Admin',
	drafter: 'Drafter',
	checker: 'Checker',
	quality: 'Supplier quality'
} as const;

export type RoleName = keyof typeof roleLabels;
export const roleNames = Object.keys(roleLabels) as RoleName[];
