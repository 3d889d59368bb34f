import { Text } from '@/components/ui/text';

export interface PickedFile {
  name: string;
  size: number;
  text: string;
}

/** Native: logger files live on a computer; the import is done from the browser. */
export function CsvFilePicker(_props: { onFile: (file: PickedFile) => void; onError: (message: string) => void; label: string }) {
  return <Text tone="muted">Import logger files from Frameside in a web browser on the computer the logger was read into.</Text>;
}
