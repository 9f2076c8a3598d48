import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type FieldValues, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { ApiError } from '@/features/api';

/**
 * react-hook-form with the shared zod schema, plus the server's answer mapped back onto the form:
 * a field error from the API shows under its field, anything else above the button.
 */
export function useApiForm<S extends z.ZodType<FieldValues, FieldValues>>(schema: S, defaultValues: z.input<S>) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema as never) as never,
    defaultValues: defaultValues as never,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const [formError, setFormError] = useState<string | null>(null);

  function showServerError(error: unknown) {
    if (error instanceof ApiError) {
      const fields = Object.entries(error.fields);
      const known = fields.filter(([name]) => name in (defaultValues as object));
      for (const [name, message] of known) form.setError(name as Path<z.input<S>>, { type: 'server', message });
      setFormError(known.length > 0 && known.length === fields.length ? null : error.message);
    } else {
      setFormError('The server could not be reached. Check the connection and try again.');
    }
  }

  return { form, formError, setFormError, showServerError };
}
