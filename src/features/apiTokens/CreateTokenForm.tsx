import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { CreateApiTokenSchema, type CreatedApiTokenDto } from "@shared/schemas/apiTokens";
import type { LabDto } from "@shared/schemas/labs";
import { useCreateApiToken } from "../../api/apiTokens";
import { Button } from "../../components/Button";
import { Field, fieldProps, inputClass } from "../../components/Field";
import { FormAlert } from "../account/FormAlert";
import { showServerErrors } from "../account/formErrors";
import { TextField } from "../account/TextField";

/** The API's schema, with the expiry as the select's value ("" = never). */
const TokenFormSchema = CreateApiTokenSchema.omit({ expiresInDays: true }).extend({ expiry: z.enum(["", "30", "90", "365"]) });
type FormInput = z.input<typeof TokenFormSchema>;
const EXPIRY: { value: FormInput["expiry"]; label: string }[] = [
  { value: "", label: "Never (until revoked)" },
  { value: "30", label: "In 30 days" },
  { value: "90", label: "In 90 days" },
  { value: "365", label: "In a year" },
];

/** Name, lab and expiry of a new token; labs where the person may only read are not offered. */
export function CreateTokenForm({ labs, defaultLabId, onCreated }: { labs: LabDto[]; defaultLabId?: string; onCreated: (t: CreatedApiTokenDto) => void }) {
  const writable = labs.filter((l) => l.can.write);
  const create = useCreateApiToken();
  const { register, handleSubmit, setError, reset, formState } = useForm<FormInput, unknown, z.output<typeof TokenFormSchema>>({
    resolver: zodResolver(TokenFormSchema),
    defaultValues: { name: "", labId: writable.find((l) => l.id === defaultLabId)?.id ?? writable[0]?.id ?? "", expiry: "" },
  });
  const { errors, isSubmitting } = formState;
  const onSubmit = handleSubmit(async (values) => {
    try {
      const { expiry, ...rest } = values;
      onCreated(await create.mutateAsync({ ...rest, expiresInDays: expiry ? Number(expiry) : null }));
      reset();
    } catch (err) {
      showServerErrors(err, setError, ["name", "labId"]);
    }
  });
  if (writable.length === 0) {
    return <p className="text-sm text-ink-soft">Tokens add runs, so they need the member or owner role in a lab; you are a viewer in every lab you belong to.</p>;
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={errors.root?.server?.message} title="Could not create the token" />
      <TextField label="Name" hint="Where it will be used, e.g. “acquisition PC, table 2”." registration={register("name")} error={errors.name?.message} />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Lab it may reach" error={errors.labId?.message} hint="A token reaches this one lab only, with your role there.">
          {(p) => (
            <select {...fieldProps(p)} {...register("labId")} className={inputClass}>
              {writable.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field label="Expires" error={errors.expiry?.message}>
          {(p) => (
            <select {...fieldProps(p)} {...register("expiry")} className={inputClass}>
              {EXPIRY.map((e) => (
                <option key={e.value} value={e.value}>
                  {e.label}
                </option>
              ))}
            </select>
          )}
        </Field>
      </div>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Creating…" : "Create token"}
      </Button>
    </form>
  );
}
