import { createBrowserRouter } from "react-router-dom";
import { AppLayout } from "./components/AppLayout";
import { HomePage } from "./pages/HomePage";
import { NotFoundPage } from "./pages/NotFoundPage";
import { StatusPage } from "./pages/StatusPage";
import { BellTestPage } from "./pages/BellTestPage";
import { FringeScanPage } from "./pages/FringeScanPage";
import { TrendsPage } from "./pages/TrendsPage";

export const router = createBrowserRouter([
  {
    element: <AppLayout />,
    children: [
      { index: true, element: <HomePage /> },
      // Bell tests, fringe scans and trends
      { path: "labs/:labId/runs/:runId/bell-test", element: <BellTestPage /> },
      { path: "labs/:labId/runs/:runId/fringe-fit", element: <FringeScanPage /> },
      { path: "labs/:labId/trends", element: <TrendsPage /> },
      { path: "status", element: <StatusPage /> },
      { path: "*", element: <NotFoundPage /> },
    ],
  },
]);
