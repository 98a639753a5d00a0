"use client";
// Making a read-only link: a label that says who it is for. A refused request keeps the typed label and
// shows the server's message beside the field.
import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { ApiError } from "@/lib/client/api";
import { shareLinkCreateSchema } from "@/lib/validation/share-link";

type FormValues = z.input<typeof shareLinkCreateSchema>;

export function ShareLinkForm({ onCreate }: { onCreate: (label: string) => Promise<void> }) {
  const form = useForm<FormValues, unknown, z.output<typeof shareLinkCreateSchema>>({ resolver: zodResolver(shareLinkCreateSchema), defaultValues: { label: "" } });
  const { errors, isSubmitting } = form.formState;

  const submit = form.handleSubmit(async ({ label }) => {
    try {
      await onCreate(label);
      form.reset({ label: "" });
    } catch (error) {
      const issue = error instanceof ApiError ? error.issues.find((item) => item.path === "label") : undefined;
      form.setError("label", { message: issue?.message ?? (error instanceof Error ? error.message : "The link was not made.") });
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label="New read-only link" className="flex flex-col gap-2">
      <TextField id="share-link-label" label="Who is the link for?" placeholder="e.g. Council planning officer" maxLength={80} error={errors.label?.message} {...form.register("label")} />
      <div>
        <Button type="submit" size="sm" disabled={isSubmitting}>
          {isSubmitting ? "Making the link…" : "Make a read-only link"}
        </Button>
      </div>
    </form>
  );
}
