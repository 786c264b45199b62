import { useState } from "react";
import type { ShareItemType } from "@shared/schemas/shares";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { SegmentedToggle } from "../../components/SegmentedToggle";
import { CreateLinkForm } from "./CreateLinkForm";
import { InviteGuestForm } from "./InviteGuestForm";
import { ShareList } from "./ShareList";
import { ITEM_LABEL, ITEM_SHORT } from "./shareWords";

/**
 * Sharing one item: a link or a guest by e-mail (members and owners), and the item's shares
 * with who made them (everyone in the lab), in a dialog.
 */
export function ShareButton({ labId, itemType, itemId, canWrite }: { labId: string; itemType: ShareItemType; itemId: string; canWrite: boolean }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <Button variant="secondary" onClick={() => setOpen(true)} aria-haspopup="dialog">
        Share {ITEM_SHORT[itemType]}
      </Button>
      <Dialog open={open} title={`Share this ${ITEM_LABEL[itemType].toLowerCase()}`} onClose={() => setOpen(false)} actions={<Button variant="secondary" onClick={() => setOpen(false)}>Close</Button>}>
        {open && <ShareDialogBody labId={labId} itemType={itemType} itemId={itemId} canWrite={canWrite} />}
      </Dialog>
    </>
  );
}

function ShareDialogBody({ labId, itemType, itemId, canWrite }: { labId: string; itemType: ShareItemType; itemId: string; canWrite: boolean }) {
  const [how, setHow] = useState<"link" | "guest">("link");
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        People outside the lab get a read-only view: the 3D bars, the figures with uncertainties, the raw counts, the method and the setup. They never see other runs, members or private notes.
      </p>
      {canWrite ? (
        <>
          <SegmentedToggle label="Share by" value={how} onChange={setHow} options={[{ value: "link", label: "Link" }, { value: "guest", label: "E-mail (guest)" }]} />
          {how === "link" ? <CreateLinkForm labId={labId} itemType={itemType} itemId={itemId} /> : <InviteGuestForm labId={labId} itemType={itemType} itemId={itemId} />}
        </>
      ) : (
        <p className="text-sm text-ink-soft">Your role in this lab is read-only, so you cannot share; members and owners can.</p>
      )}
      <div>
        <h3 className="mb-1 font-bold text-ink">Shares of this item</h3>
        <ShareList labId={labId} item={{ itemType, itemId }} canRevoke={canWrite} />
      </div>
    </div>
  );
}
