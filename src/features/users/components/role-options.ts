import { roleLabels, roles } from '../../../../shared/schemas/common';

export const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));
