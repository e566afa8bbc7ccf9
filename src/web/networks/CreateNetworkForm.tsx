'use client';
import { useRouter } from 'next/navigation';
import { apiSend } from '@/src/web/swr';
import { Button, FormField, inputClass, Notice } from '@/src/web/ui';
import { useApiForm } from '@/src/web/account/useApiForm';

export function CreateNetworkForm() {
  const router = useRouter();
  const f = useApiForm();
  const submit = f.onSubmit(async (d) => {
    const r = await apiSend<{ network: { id: string } }>('POST', '/api/networks', { name: d.get('name') });
    router.push(`/n/${r.network.id}`);
    router.refresh();
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-3">
      <FormField
        id="network-name"
        label="Network name"
        hint="1–120 characters; you become its owner and can invite colleagues."
        error={f.fieldError('name')}
        className="min-w-64 flex-1"
      >
        <input name="name" required maxLength={120} className={inputClass} placeholder="e.g. Northern valleys ELF array" />
      </FormField>
      <Button type="submit" busy={f.busy} className="mb-5">
        Create network
      </Button>
      {f.formError(['name']) ? (
        <Notice tone="error" className="w-full">
          {f.formError(['name'])}
        </Notice>
      ) : null}
    </form>
  );
}
