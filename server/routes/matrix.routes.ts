import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { benchWorkers, planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  assignCellsRequestSchema,
  assignCellsResponseSchema,
  cellParamsSchema,
  cellTransitionRequestSchema,
  matrixCellSchema,
  roundupMatrixSchema,
  testerListSchema,
} from '../../shared/schemas/matrix';

export function registerMatrixRoutes(api: ApiRegistry, { services }: AppContext) {
  const matrix = services.matrix;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/matrix',
    access: planningReaders,
    tag: 'Matrix',
    summary: 'Products × load configurations with each cell’s state, tester, due date and your possible actions.',
    params: idParamSchema,
    response: roundupMatrixSchema,
    handler: ({ params, user }) => matrix.matrix(params.id, user),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/assignments',
    access: planEditors,
    tag: 'Matrix',
    summary: 'Assign cells and/or whole rows to a tester with a due date.',
    params: idParamSchema,
    body: assignCellsRequestSchema,
    response: assignCellsResponseSchema,
    successStatus: 200,
    handler: async ({ params, user, body }) => ({ cells: await matrix.assign(user, params.id, body) }),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/cells/:cellId/transitions',
    access: benchWorkers,
    tag: 'Matrix',
    summary:
      'Move a cell: testers start, pause and record their own cells; editors accept, send back (with a reason) or unassign.',
    params: cellParamsSchema,
    body: cellTransitionRequestSchema,
    response: matrixCellSchema,
    successStatus: 200,
    handler: ({ params, user, body }) =>
      matrix.transition(
        user,
        params.id,
        params.cellId,
        body.action,
        body.note ?? undefined,
        body.overrideReason ?? undefined,
      ),
  });

  api.add({
    method: 'get',
    path: '/api/testers',
    access: planEditors,
    tag: 'Matrix',
    summary: 'Active bench testers, for assigning cells.',
    response: testerListSchema,
    handler: async () => ({ testers: await matrix.testers() }),
  });
}
