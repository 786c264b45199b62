import { useLocation } from "react-router-dom";
import { useMe } from "../../api/auth";
import { ButtonLink } from "../../components/Button";
import { LabSwitcher } from "../labs/LabSwitcher";
import { AccountMenu } from "./AccountMenu";

/** The right end of the header: lab switcher and account menu, or the ways in when signed out. */
export function HeaderAccountArea() {
  const me = useMe();
  const { pathname } = useLocation();
  if (me.isPending) return null;
  if (!me.data) {
    return (
      <>
        {pathname !== "/sign-in" && (
          <ButtonLink to="/sign-in" variant="quiet" size="sm">
            Sign in
          </ButtonLink>
        )}
        {pathname !== "/sign-up" && (
          <ButtonLink to="/sign-up" variant="secondary" size="sm">
            Create account
          </ButtonLink>
        )}
      </>
    );
  }
  return (
    <>
      <LabSwitcher />
      <AccountMenu me={me.data} />
    </>
  );
}
