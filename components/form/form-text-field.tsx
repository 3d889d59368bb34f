import { useField, useFormikContext } from 'formik';
import { TextField, type TextFieldProps } from '@/components/ui/text-field';

export interface FormTextFieldProps extends Omit<TextFieldProps, 'value' | 'onChangeText' | 'error'> {
  /** The Formik path, e.g. "email" or "queen.note". */
  name: string;
}

/** A TextField bound to the surrounding Formik form; its error appears once the field is left. */
export function FormTextField({ name, onBlur, ...rest }: FormTextFieldProps) {
  const [field, meta, helpers] = useField<string>(name);
  const { submitCount } = useFormikContext();
  const error = meta.error && (meta.touched || submitCount > 0) ? meta.error : undefined;
  return (
    <TextField
      {...rest}
      value={field.value ?? ''}
      onChangeText={(text) => void helpers.setValue(text)}
      onBlur={(e) => {
        void helpers.setTouched(true);
        onBlur?.(e);
      }}
      error={error}
    />
  );
}
