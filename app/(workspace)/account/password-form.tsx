'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { Field } from '@/components/ui/field';

export function PasswordForm() {
  const [form, setForm] = useState({ currentPassword: '', newPassword: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const change = useMutation({
    mutationFn: () => api('/api/account/password', { body: form }),
    onSuccess: () => { setErrors({}); setForm({ currentPassword: '', newPassword: '' }); },
    onError: (e) => setErrors(e instanceof ApiError ? { ...e.fieldErrors(), form: e.message } : { form: String(e) }),
  });
  return (
    <form className="space-y-3" noValidate onSubmit={(e) => { e.preventDefault(); change.mutate(); }} aria-label="Change password">
      <h2 className="font-semibold">Change password</h2>
      {errors.form && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
      {change.isSuccess && <p role="status" className="text-sm text-ok">Password changed.</p>}
      <Field label="Current password" error={errors.currentPassword}>{(p) => <input {...p} type="password" autoComplete="current-password" className="field-input" value={form.currentPassword} onChange={(e) => setForm({ ...form, currentPassword: e.target.value })} />}</Field>
      <Field label="New password" hint="At least 10 characters." error={errors.newPassword}>{(p) => <input {...p} type="password" autoComplete="new-password" className="field-input" value={form.newPassword} onChange={(e) => setForm({ ...form, newPassword: e.target.value })} />}</Field>
      <button className="btn-primary" disabled={change.isPending}>Change password</button>
    </form>
  );
}
