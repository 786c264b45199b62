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
import { BellTestPage } from "./pages/BellTestPage";
import { FringeScanPage } from "./pages/FringeScanPage";
import { TrendsPage } from "./pages/TrendsPage";
import { ComparePage } from "./pages/ComparePage";
import { LabHomePage } from "./pages/LabHomePage";
import { NewRunPage } from "./pages/NewRunPage";
import { NewSessionPage } from "./pages/NewSessionPage";
import { RunPage } from "./pages/RunPage";
import { SessionPage } from "./pages/SessionPage";
import { SourcesPage } from "./pages/SourcesPage";

export const router = createBrowserRouter([
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
      // The notebook: sources, sessions, runs, state view, compare
      { path: "labs/:labId", element: <LabHomePage /> },
      { path: "labs/:labId/sources", element: <SourcesPage /> },
      { path: "labs/:labId/sessions/new", element: <NewSessionPage /> },
      { path: "labs/:labId/sessions/:sessionId", element: <SessionPage /> },
      { path: "labs/:labId/sessions/:sessionId/runs/new", element: <NewRunPage /> },
      { path: "labs/:labId/runs/:runId", element: <RunPage /> },
      { path: "labs/:labId/compare", element: <ComparePage /> },
      // Bell tests, fringe scans and trends
      { path: "labs/:labId/runs/:runId/bell-test", element: <BellTestPage /> },
      { path: "labs/:labId/runs/:runId/fringe-fit", element: <FringeScanPage /> },
      { path: "labs/:labId/trends", element: <TrendsPage /> },
      { path: "status", element: <StatusPage /> },
      { path: "*", element: <NotFoundPage /> },
    ],
  },
]);
