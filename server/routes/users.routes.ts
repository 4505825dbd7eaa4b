import type { ApiRegistry } from '../api-registry';
import { accountManagers } from '../../shared/access/roles';
import type { AppContext } from '../app-context';
import { noStore } from '../middleware/no-store';
import { idParamSchema } from '../../shared/schemas/common';
import {
  createUserRequestSchema,
  updateUserRequestSchema,
  userListSchema,
  userSchema,
} from '../../shared/schemas/users';

export function registerUserRoutes(api: ApiRegistry, { services }: AppContext) {
  const users = services.users;
  api.router.use('/api/users', noStore);

  api.add({
    method: 'get',
    path: '/api/users',
    access: accountManagers,
    tag: 'Users',
    summary: 'All staff accounts.',
    response: userListSchema,
    handler: async () => ({ users: await users.list() }),
  });

  api.add({
    method: 'post',
    path: '/api/users',
    access: accountManagers,
    tag: 'Users',
    summary: 'Create a staff account.',
    body: createUserRequestSchema,
    response: userSchema,
    handler: ({ user, body }) => users.create(user, body),
  });

  api.add({
    method: 'patch',
    path: '/api/users/:id',
    access: accountManagers,
    tag: 'Users',
    summary: 'Edit, deactivate or reactivate an account, change its role or reset its password.',
    params: idParamSchema,
    body: updateUserRequestSchema,
    response: userSchema,
    handler: ({ user, params, body }) => users.update(user, params.id, body),
  });
}
