import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate } from "react-router-dom";
import { UpdateLabSchema, type LabDto, type UpdateLab } from "@shared/schemas/labs";
import { useDeleteLab, useUpdateLab } from "../../api/labs";
import { Alert } from "../../components/Alert";
import { Button } from "../../components/Button";
import { Dialog } from "../../components/Dialog";
import { inputClass } from "../../components/Field";
import { FormAlert } from "../account/FormAlert";
import { showServerErrors } from "../account/formErrors";
import { TextField } from "../account/TextField";

/** Owners rename the lab, or delete it with everything in it after typing its name. */
export function LabSettings({ lab }: { lab: LabDto }) {
  const update = useUpdateLab(lab.id);
  const remove = useDeleteLab(lab.id);
  const navigate = useNavigate();
  const [confirming, setConfirming] = useState(false);
  const [typed, setTyped] = useState("");
  const confirmId = useId();
  const { register, handleSubmit, setError, formState } = useForm<UpdateLab>({ resolver: zodResolver(UpdateLabSchema), values: { name: lab.name, institution: lab.institution } });
  const { errors, isSubmitting, isDirty } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      await update.mutateAsync(values);
    } catch (err) {
      showServerErrors(err, setError, ["name", "institution"]);
    }
  });

  return (
    <div className="space-y-6">
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        <FormAlert message={errors.root?.server?.message} title="Could not save" />
        {update.isSuccess && !isDirty && <Alert kind="success" title="Saved">The lab's name and institution are updated.</Alert>}
        <TextField label="Lab name" registration={register("name")} error={errors.name?.message} />
        <TextField label="Institution" registration={register("institution")} error={errors.institution?.message} />
        <Button type="submit" variant="secondary" disabled={isSubmitting || !isDirty}>
          Save
        </Button>
      </form>
      <div className="rounded-md border border-danger p-4">
        <h3 className="font-bold text-danger">Delete this lab</h3>
        <p className="mt-1 text-sm text-ink-soft">Deletes every source, session, run, reconstruction and invitation in it, for everyone. This cannot be undone.</p>
        <Button variant="danger" className="mt-3" onClick={() => setConfirming(true)}>
          Delete lab…
        </Button>
      </div>
      <Dialog
        open={confirming}
        title={`Delete “${lab.name}”?`}
        onClose={() => {
          setConfirming(false);
          setTyped("");
        }}
        actions={
          <>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
            <Button variant="danger" disabled={typed.trim() !== lab.name || remove.isPending} onClick={() => remove.mutate(undefined, { onSuccess: () => navigate("/", { replace: true }) })}>
              {remove.isPending ? "Deleting…" : "Delete for everyone"}
            </Button>
          </>
        }
      >
        {remove.error && <Alert kind="error">{remove.error.message}</Alert>}
        <label htmlFor={confirmId} className="mt-2 block text-sm font-bold text-ink">
          Type the lab's name to confirm
        </label>
        <input id={confirmId} className={`${inputClass} mt-1`} value={typed} onChange={(e) => setTyped(e.target.value)} autoComplete="off" />
      </Dialog>
    </div>
  );
}
