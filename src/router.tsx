import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./components/AppLayout";
import { HomePage } from "./pages/HomePage";
import { AccountPage } from "./pages/AccountPage";
import { DevOutboxPage } from "./pages/DevOutboxPage";
import { ForgotPasswordPage } from "./pages/ForgotPasswordPage";
import { InvitationPage } from "./pages/InvitationPage";
import { MembersPage } from "./pages/MembersPage";
import { NewLabPage } from "./pages/NewLabPage";
import { ResetPasswordPage } from "./pages/ResetPasswordPage";
import { SignInPage } from "./pages/SignInPage";
import { SignUpPage } from "./pages/SignUpPage";
import { VerifyEmailPage } from "./pages/VerifyEmailPage";
import { HomeGate } from "./features/labs/HomeGate";
import { NotFoundPage } from "./pages/NotFoundPage";
import { StatusPage } from "./pages/StatusPage";

export const router = createBrowserRouter([
  // Pages that stand on their own (no lab navigation): a share link, a printable report.
  { path: "shared/:token", lazy: async () => ({ Component: (await import("./pages/SharedLinkPage")).SharedLinkPage }) },
  { path: "labs/:labId/reports/:itemType/:itemId", lazy: async () => ({ Component: (await import("./pages/ReportPage")).ReportPage }) },
  {
    element: <AppLayout />,
    children: [
      { index: true, element: <HomeGate signedOut={<HomePage />} /> },
      // Accounts, labs and people
      { path: "sign-in", element: <SignInPage /> },
      { path: "sign-up", element: <SignUpPage /> },
      { path: "verify-email", element: <VerifyEmailPage /> },
      { path: "forgot-password", element: <ForgotPasswordPage /> },
      { path: "reset-password", element: <ResetPasswordPage /> },
      { path: "invitation", element: <InvitationPage /> },
      { path: "account", element: <AccountPage /> },
      { path: "dev/outbox", element: <DevOutboxPage /> },
      { path: "labs/new", element: <NewLabPage /> },
      { path: "labs/:labId/members", element: <MembersPage /> },
      // The notebook: sources, sessions, runs, state view, compare (loaded when first visited)
      { path: "labs/:labId", lazy: async () => ({ Component: (await import("./pages/LabHomePage")).LabHomePage }) },
      { path: "labs/:labId/sources", lazy: async () => ({ Component: (await import("./pages/SourcesPage")).SourcesPage }) },
      { path: "labs/:labId/sessions/new", lazy: async () => ({ Component: (await import("./pages/NewSessionPage")).NewSessionPage }) },
      { path: "labs/:labId/sessions/:sessionId", lazy: async () => ({ Component: (await import("./pages/SessionPage")).SessionPage }) },
      { path: "labs/:labId/sessions/:sessionId/runs/new", lazy: async () => ({ Component: (await import("./pages/NewRunPage")).NewRunPage }) },
      { path: "labs/:labId/runs/:runId", lazy: async () => ({ Component: (await import("./pages/RunPage")).RunPage }) },
      { path: "labs/:labId/compare", lazy: async () => ({ Component: (await import("./pages/ComparePage")).ComparePage }) },
      // Bell tests, fringe scans and trends
      { path: "labs/:labId/runs/:runId/bell-test", lazy: async () => ({ Component: (await import("./pages/BellTestPage")).BellTestPage }) },
      { path: "labs/:labId/runs/:runId/fringe-fit", lazy: async () => ({ Component: (await import("./pages/FringeScanPage")).FringeScanPage }) },
      { path: "labs/:labId/sessions/:sessionId/bell-test/new", lazy: async () => ({ Component: (await import("./pages/NewBellTestPage")).NewBellTestPage }) },
      { path: "labs/:labId/sessions/:sessionId/fringe-scan/new", lazy: async () => ({ Component: (await import("./pages/NewFringeScanPage")).NewFringeScanPage }) },
      { path: "labs/:labId/trends", lazy: async () => ({ Component: (await import("./pages/TrendsPage")).TrendsPage }) },
      // Sharing and exports
      { path: "shared-with-me", lazy: async () => ({ Component: (await import("./pages/SharedWithMePage")).SharedWithMePage }) },
      { path: "guest/:shareId", lazy: async () => ({ Component: (await import("./pages/GuestSharePage")).GuestSharePage }) },
      { path: "labs/:labId/shares", lazy: async () => ({ Component: (await import("./pages/LabSharesPage")).LabSharesPage }) },
      { path: "labs/:labId/import", lazy: async () => ({ Component: (await import("./pages/ImportBundlePage")).ImportBundlePage }) },
      // Batch uploads and personal API tokens
      { path: "labs/:labId/batches", lazy: async () => ({ Component: (await import("./pages/BatchUploadPage")).BatchUploadPage }) },
      { path: "labs/:labId/batches/:batchId", lazy: async () => ({ Component: (await import("./pages/BatchPage")).BatchPage }) },
      { path: "tokens", lazy: async () => ({ Component: (await import("./pages/ApiTokensPage")).ApiTokensPage }) },
      { path: "status", element: <StatusPage /> },
      { path: "*", element: <NotFoundPage /> },
    ],
  },
]);
