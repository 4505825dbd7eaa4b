import type { QueryClient } from '@tanstack/react-query';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { CatalogImport } from '../../features/catalog/components/catalog-import';
import { ForbiddenState } from '../../components/ui/forbidden-state';
import { roleLabels } from '../../../shared/schemas/common';
import { RoleGate } from '../role-gate';
import { catalogEditors, may } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(sessionQueryOptions());
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.catalog} pageName="Catalog">
      <ImportPage />
    </RoleGate>
  );
}

function ImportPage() {
  const user = useSession();
  if (!user) return null;
  if (!may(user.role, catalogEditors))
    return <ForbiddenState pageName="Catalog import" roleLabel={roleLabels[user.role]} />;
  return <CatalogImport />;
}
