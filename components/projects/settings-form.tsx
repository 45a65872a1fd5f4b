"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, Notice } from "@/components/ui/card";
import { Field, Input, Textarea } from "@/components/ui/field";
import { ApiError, apiFetch } from "@/lib/client/api";
import type { ProjectSettings } from "@/lib/projects/settings";
import { type SettingsDraft, SettingsFields } from "./settings-fields";

export function SettingsForm({ projectId, initial }: { projectId: number; initial: { name: string; description: string; settings: ProjectSettings } }) {
  const router = useRouter();
  const [name, setName] = useState(initial.name);
  const [description, setDescription] = useState(initial.description);
  const [settings, setSettings] = useState<SettingsDraft>(initial.settings);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [msg, setMsg] = useState<{ tone: "error" | "success"; text: string } | null>(null);
  const [pending, setPending] = useState(false);

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setPending(true);
    setMsg(null);
    setErrors({});
    try {
      await apiFetch(`/api/v1/projects/${projectId}`, { method: "PATCH", body: { name, description, settings } });
      setMsg({ tone: "success", text: "Settings saved. Suggestion changes apply to the next item shown." });
      router.refresh();
    } catch (err) {
      if (err instanceof ApiError) {
        setMsg({ tone: "error", text: err.message });
        setErrors(Object.fromEntries(err.fields.map((f) => [f.path, f.message])));
      } else setMsg({ tone: "error", text: "Saving failed. Check your connection." });
    } finally {
      setPending(false);
    }
  }

  return (
    <form onSubmit={save} className="space-y-6" noValidate>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      <Card title="Project">
        <div className="space-y-4">
          <Field label="Name" htmlFor="name" error={errors.name}>
            <Input id="name" value={name} onChange={(e) => setName(e.target.value)} />
          </Field>
          <Field label="Description" htmlFor="description" error={errors.description}>
            <Textarea id="description" rows={3} value={description} onChange={(e) => setDescription(e.target.value)} />
          </Field>
        </div>
      </Card>
      <Card title="Labelling and suggestions">
        <SettingsFields value={settings} onChange={setSettings} errors={errors} />
      </Card>
      <div className="flex justify-end">
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : "Save settings"}
        </Button>
      </div>
    </form>
  );
}
