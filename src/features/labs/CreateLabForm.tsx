import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useNavigate } from "react-router-dom";
import type { z } from "zod";
import { CreateLabSchema } from "@shared/schemas/labs";
import { useCreateLab } from "../../api/labs";
import { Button } from "../../components/Button";
import { FormAlert } from "../account/FormAlert";
import { showServerErrors } from "../account/formErrors";
import { TextField } from "../account/TextField";

/** Name and institution of a new lab; its creator becomes its owner and lands in it. */
export function CreateLabForm() {
  const navigate = useNavigate();
  const create = useCreateLab();
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof CreateLabSchema>, unknown, z.output<typeof CreateLabSchema>>({
    resolver: zodResolver(CreateLabSchema),
    defaultValues: { name: "", institution: "" },
  });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      const lab = await create.mutateAsync(values);
      navigate(`/labs/${lab.id}`);
    } catch (err) {
      showServerErrors(err, setError, ["name", "institution"]);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message} title="Could not create the lab" />
      <TextField label="Lab name" hint="For example “Entangled Photon Lab”. You can rename it later." autoFocus registration={register("name")} error={errors.name?.message} />
      <TextField label="Institution (optional)" autoComplete="organization" registration={register("institution")} error={errors.institution?.message} />
      <p className="text-sm text-ink-soft">You become the lab's owner: you invite people and choose what each of them may do.</p>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Creating…" : "Create lab"}
      </Button>
    </form>
  );
}
