import { getIn, setIn, type FormikErrors, type FormikTouched } from 'formik';
import type { z } from 'zod';

/**
 * Formik's `validate` from a zod schema — the same schema the server parses the request with,
 * so the form and the API cannot disagree. Form values may be shaped for the controls (e.g. a
 * "year known" switch); `toInput` maps them to the request body. Issue paths are written into
 * Formik's nested error shape (`boxes.0.frames` → `errors.boxes[0].frames`); the first issue
 * on a path wins, as zod lists the most basic problem first.
 */
export function zodFormikValidate<S extends z.ZodType, Values = z.input<S>>(
  schema: S,
  toInput: (values: Values) => z.input<S> = (values) => values as z.input<S>,
): (values: Values) => FormikErrors<Values> {
  return (values) => {
    const result = schema.safeParse(toInput(values));
    if (result.success) return {};
    let errors: FormikErrors<Values> = {};
    for (const issue of result.error.issues) {
      if (issue.path.length === 0) continue; // whole-object issues have no field to sit beside
      const path = issue.path.map(String).join('.');
      if (getIn(errors, path) === undefined) errors = setIn(errors, path, issue.message);
    }
    return errors;
  };
}

/** The server's `fields` map (`{ "boxes.0.frames": "…" }`) in Formik's error shape. */
export function serverFieldErrors<Values>(fields: Record<string, string>): FormikErrors<Values> {
  let errors: FormikErrors<Values> = {};
  for (const [path, message] of Object.entries(fields)) errors = setIn(errors, path, message);
  return errors;
}

/**
 * The error to show for a field: only once it was touched (left, or the form was submitted),
 * so a keeper is not scolded for fields not yet reached.
 */
export function visibleError<Values>(
  errors: FormikErrors<Values>,
  touched: FormikTouched<Values>,
  path: string,
  submitCount = 0,
): string | undefined {
  const error: unknown = getIn(errors, path);
  if (typeof error !== 'string') return undefined;
  return getIn(touched, path) || submitCount > 0 ? error : undefined;
}
