"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { TextField } from "@/components/ui/text-field";
import { ApiError } from "@/lib/client/api";
import { sceneTemplates } from "@/lib/scene-templates";

/** Starts a scene from one of the templates; the scene's block appears at the end of the notebook. */
export function AddSceneForm({ onAdd, onClose }: { onAdd: (input: { name: string; templateId: string; isReference: boolean }) => Promise<unknown>; onClose: () => void }) {
  const [templateId, setTemplateId] = useState(sceneTemplates[0]!.id);
  const [name, setName] = useState(sceneTemplates[0]!.title);
  const [isReference, setIsReference] = useState(false);
  const [nameError, setNameError] = useState<string | undefined>();
  const [failure, setFailure] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    if (!name.trim()) {
      setNameError("Give the scene a name.");
      return;
    }
    setPending(true);
    setFailure(null);
    try {
      await onAdd({ name: name.trim(), templateId, isReference });
      onClose();
    } catch (error) {
      if (error instanceof ApiError && error.issues.some((issue) => issue.path === "name")) setNameError(error.issues.find((issue) => issue.path === "name")!.message);
      else setFailure(error instanceof Error ? error.message : "The scene was not created.");
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={submit} aria-label="New scene" className="flex flex-col gap-4 rounded-lg border border-rule bg-panel p-5 shadow-sm">
      <h3 className="font-semibold text-ink">New scene from a template</h3>
      <fieldset className="grid gap-2 sm:grid-cols-2">
        <legend className="sr-only">Template</legend>
        {sceneTemplates.map((template) => (
          <label
            key={template.id}
            className={`flex cursor-pointer flex-col gap-1 rounded-md border p-3 text-sm transition ${templateId === template.id ? "border-tide-500 bg-tide-50" : "border-rule hover:border-rule-strong"}`}
          >
            <span className="flex items-center gap-2 font-medium text-ink">
              <input
                type="radio"
                name="template"
                value={template.id}
                checked={templateId === template.id}
                onChange={() => {
                  setTemplateId(template.id);
                  setName(template.title);
                }}
                className="accent-tide-600"
              />
              {template.title}
            </span>
            <span className="text-muted">{template.summary}</span>
          </label>
        ))}
      </fieldset>
      <TextField id="new-scene-name" label="Scene name" value={name} error={nameError} onChange={(event) => { setName(event.target.value); setNameError(undefined); }} />
      <label className="flex items-center gap-2 text-sm text-ink-soft">
        <input type="checkbox" checked={isReference} onChange={(event) => setIsReference(event.target.checked)} className="accent-tide-600" />
        This is the reference (insertion loss is measured against it)
      </label>
      {failure ? <ErrorState title="The scene was not created" message={failure} /> : null}
      <div className="flex justify-end gap-3">
        <Button variant="secondary" onClick={onClose} disabled={pending}>
          Cancel
        </Button>
        <Button type="submit" disabled={pending}>
          {pending ? "Creating…" : "Create scene"}
        </Button>
      </div>
    </form>
  );
}
