"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { TextAreaField, TextField } from "@/components/ui/text-field";
import { ApiError } from "@/lib/client/api";
import { useCreateStudy } from "@/lib/client/queries";
import { studyInputSchema } from "@/lib/validation/study";

type StudyFormValues = z.input<typeof studyInputSchema>;
const fieldNames = ["title", "description", "siteReference"] as const;

export function CreateStudyForm({ teamId, onDone }: { teamId: string; onDone: () => void }) {
  const router = useRouter();
  const createStudy = useCreateStudy(teamId);
  const form = useForm<StudyFormValues, unknown, z.output<typeof studyInputSchema>>({
    resolver: zodResolver(studyInputSchema),
    defaultValues: { title: "", description: "", siteReference: "" },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const { study } = await createStudy.mutateAsync(values);
      onDone();
      router.push(`/studies/${study.id}`);
    } catch (error) {
      if (error instanceof ApiError && error.issues.length > 0) {
        // The server's 400 names the field: show its message there, keep everything typed.
        for (const issue of error.issues) {
          const field = fieldNames.find((name) => name === issue.path);
          form.setError(field ?? "root", { message: issue.message });
        }
      } else {
        form.setError("root", { message: error instanceof Error ? error.message : "The study could not be created." });
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New study" className="flex flex-col gap-4 rounded-lg border border-rule bg-panel p-6 shadow-sm">
      <div>
        <h2 className="text-lg font-semibold text-ink">New study</h2>
        <p className="text-sm text-muted">A study holds one acoustic question: its scenes, variants, runs and conclusions.</p>
      </div>
      <div className="grid gap-4 md:grid-cols-[2fr_1fr]">
        <TextField id="study-title" label="Title" placeholder="e.g. Plant room louvre: noise to the nearest flats" error={errors.title?.message} {...form.register("title")} />
        <TextField
          id="study-site-reference"
          label="Site or project reference"
          placeholder="e.g. FH-2026-021"
          hint="Optional; printed on reports."
          error={errors.siteReference?.message}
          {...form.register("siteReference")}
        />
      </div>
      <TextAreaField
        id="study-description"
        label="Description"
        placeholder="What is the question, what are the constraints, who asked?"
        error={errors.description?.message}
        {...form.register("description")}
      />
      {errors.root ? <ErrorState title="The study was not created" message={errors.root.message ?? ""} /> : null}
      <div className="flex justify-end gap-3">
        <Button variant="secondary" onClick={onDone} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create study"}
        </Button>
      </div>
    </form>
  );
}
