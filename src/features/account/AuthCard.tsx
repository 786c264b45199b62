import { PageTitle } from "../../components/PageTitle";

/** The narrow centred card of the sign-in, sign-up and link pages. */
export function AuthCard({ title, subtitle, children, footer }: { title: string; subtitle?: React.ReactNode; children: React.ReactNode; footer?: React.ReactNode }) {
  return (
    <div className="mx-auto w-full max-w-md py-6">
      <PageTitle subtitle={subtitle}>{title}</PageTitle>
      <div className="rounded-lg border border-paper-sunk bg-paper-raised p-6 shadow-sm">{children}</div>
      {footer && <div className="mt-4 space-y-1 text-center text-sm text-ink-soft">{footer}</div>}
    </div>
  );
}

export const linkClass = "font-bold text-petrol-700 underline hover:text-petrol-800";
