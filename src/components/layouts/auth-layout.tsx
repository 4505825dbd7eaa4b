import type { ReactNode } from 'react';
import { BenchwireMark } from './benchwire-mark';

export interface AuthLayoutProps {
  children: ReactNode;
}

/** The frame of the signed-out pages: the name, one narrow column, nothing else. */
export function AuthLayout({ children }: AuthLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-10 sm:justify-center sm:py-16">
      <main id="main" className="w-full max-w-sm">
        <p className="mb-6 flex items-center gap-2.5 text-ink">
          <BenchwireMark className="size-7" />
          <span className="text-2xl font-bold tracking-tight">Benchwire</span>
        </p>
        {children}
      </main>
      <p className="mt-10 max-w-sm text-center text-xs text-muted">
        Test lab and publishing workbench for independent hardware-review outlets.
      </p>
    </div>
  );
}
