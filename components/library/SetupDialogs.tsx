// The library's dialogs: a new setup, a copy (of a setup or a template), and the confirmation before a
// delete. Forms use react-hook-form with the shared schemas from model/forms.ts, taken through lazyResolver
// (the schemas' chunk, with zod, loads at the page's first touch, not with the library's route chunk); the
// server's field errors show beside the field too.
import { useEffect } from 'react';
import { useForm, type Control, type FieldValues, type Path, type UseFormSetError } from 'react-hook-form';
import type { z } from 'zod';
import { ApiRequestError } from '../../hooks/api';
import { lazyResolver, loadFormSchemas } from '../../hooks/lazyResolver';
import type { StudioSummary, SetupSummary } from '../../model/api';
import type { duplicateForm, newSetupForm } from '../../model/forms';
import { ChoiceField } from '../ChoiceField';
import { Dialog, DialogActions } from '../Dialog';
import { FormField } from '../FormField';
import { Body, Button, ErrorText } from '../ui';

const roleWords = { owner: 'owner', editor: 'editor', crew: 'crew' } as const;
export const writableStudios = (studios: StudioSummary[]) => studios.filter((s) => s.role === 'owner' || s.role === 'editor');
const studioOptions = (studios: StudioSummary[]) => writableStudios(studios).map((s) => ({ value: s.id, label: s.personal ? `${s.name} (personal)` : s.name, hint: `you are ${roleWords[s.role]}` }));

/** Put a server's 400 field errors beside the fields; returns the message for anything else. */
export function showServerError<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, fields: Path<T>[]): string | null {
  if (err instanceof ApiRequestError) {
    let placed = false;
    for (const [k, msg] of Object.entries(err.fields)) {
      const f = fields.find((name) => k === name || k.startsWith(`${name}.`));
      if (f) {
        setError(f, { message: msg });
        placed = true;
      }
    }
    if (placed) return null;
  }
  return err instanceof Error ? err.message : 'Something went wrong.';
}

type NewValues = z.input<typeof newSetupForm>;

export function NewSetupDialog({
  visible,
  studios,
  defaultStudio,
  onClose,
  onSubmit,
}: {
  visible: boolean;
  studios: StudioSummary[];
  defaultStudio?: string;
  onClose: () => void;
  onSubmit: (v: z.output<typeof newSetupForm>) => Promise<void>;
}) {
  const options = studioOptions(studios);
  const first = options.find((o) => o.value === defaultStudio)?.value ?? options[0]?.value ?? '';
  const { control: typed, handleSubmit, formState, reset, setError } = useForm<NewValues, unknown, z.output<typeof newSetupForm>>({
    resolver: lazyResolver<NewValues, z.output<typeof newSetupForm>>((s) => s.newSetupForm),
    defaultValues: { title: '', studioId: first, tags: '' },
  });
  // The fields edit the typed text (tags as one line); only submit sees the parsed values.
  const control = typed as unknown as Control<NewValues>;
  useEffect(() => {
    if (!visible) return;
    reset({ title: '', studioId: first, tags: '' });
    void loadFormSchemas().catch(() => {}); // ready before the first submit
  }, [visible, first, reset]);
  const submit = handleSubmit(async (v) => {
    try {
      await onSubmit(v);
    } catch (err) {
      const other = showServerError(err, setError, ['title', 'studioId', 'tags']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <Dialog visible={visible} title="New setup" onClose={onClose}>
      <FormField control={control} name="title" label="Title" placeholder="e.g. Window light for the Okafor family" error={formState.errors.title?.message} onSubmitEditing={submit} autoFocus testID="new-title" />
      {options.length > 1 ? <ChoiceField control={control} name="studioId" label="Studio" options={options} error={formState.errors.studioId?.message} /> : null}
      <FormField control={control} name="tags" label="Tags (comma-separated, optional)" placeholder="portrait, one light" error={formState.errors.tags?.message} autoCapitalize="none" />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <DialogActions>
        <Button label="Cancel" kind="quiet" onPress={onClose} />
        <Button label="Create and open" onPress={submit} busy={formState.isSubmitting} testID="create-setup" />
      </DialogActions>
    </Dialog>
  );
}

type CopyValues = z.input<typeof duplicateForm>;

export function DuplicateDialog({
  source,
  studios,
  onClose,
  onSubmit,
}: {
  source: SetupSummary | null;
  studios: StudioSummary[];
  onClose: () => void;
  onSubmit: (source: SetupSummary, v: z.output<typeof duplicateForm>) => Promise<void>;
}) {
  const options = studioOptions(studios);
  // The source's own studio when the user may write there, else their first writable one (their own).
  const start = (src: SetupSummary | null) => ({
    title: src ? `${src.title.slice(0, 193)} (copy)` : '',
    studioId: options.find((o) => o.value === src?.studioId)?.value ?? options[0]?.value ?? '',
  });
  const { control, handleSubmit, formState, reset, setError } = useForm<CopyValues, unknown, z.output<typeof duplicateForm>>({
    resolver: lazyResolver<CopyValues, z.output<typeof duplicateForm>>((s) => s.duplicateForm),
    defaultValues: start(source),
  });
  useEffect(() => {
    if (!source) return;
    reset(start(source));
    void loadFormSchemas().catch(() => {}); // ready before the first submit
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [source?.id, reset]);
  const submit = handleSubmit(async (v) => {
    if (!source) return;
    try {
      await onSubmit(source, v);
    } catch (err) {
      const other = showServerError(err, setError, ['title', 'studioId']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <Dialog visible={!!source} title={source?.isTemplate ? 'Use this template' : 'Duplicate setup'} onClose={onClose}>
      <Body dim style={{ marginBottom: 16 }}>
        {source?.isTemplate
          ? 'Makes your own setup from it: the plan, notes, steps and shot list. The template itself stays as it is.'
          : 'Makes a new setup with the same plan, notes, steps and shot list. Its history starts fresh.'}
      </Body>
      <FormField control={control} name="title" label="Title of the copy" error={formState.errors.title?.message} onSubmitEditing={submit} testID="copy-title" />
      {options.length > 1 ? <ChoiceField control={control} name="studioId" label="Into studio" options={options} error={formState.errors.studioId?.message} /> : null}
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <DialogActions>
        <Button label="Cancel" kind="quiet" onPress={onClose} />
        <Button label="Make the copy" onPress={submit} busy={formState.isSubmitting} testID="make-copy" />
      </DialogActions>
    </Dialog>
  );
}

export function ConfirmDeleteDialog({ setup, onClose, onConfirm }: { setup: SetupSummary | null; onClose: () => void; onConfirm: (s: SetupSummary) => void }) {
  return (
    <Dialog visible={!!setup} title="Delete this setup?" onClose={onClose}>
      <Body>“{setup?.title}” moves to Deleted, where anyone who can edit it may restore it for 30 days.</Body>
      <DialogActions>
        <Button label="Keep it" kind="quiet" onPress={onClose} />
        <Button label="Delete" onPress={() => setup && onConfirm(setup)} testID="confirm-delete" />
      </DialogActions>
    </Dialog>
  );
}
