import { useRef } from 'react';
import { BigButton } from '@/components/ui/big-button';
import { SENSOR_CSV_MAX_BYTES } from '@/shared/schemas/sensors';

export interface PickedFile {
  name: string;
  size: number;
  text: string;
}

/** A big button that opens the browser's file chooser for a CSV file and reads it as text (UTF-8). */
export function CsvFilePicker({ onFile, onError, label }: { onFile: (file: PickedFile) => void; onError: (message: string) => void; label: string }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        accept=".csv,.txt,.tsv,text/csv,text/plain"
        data-testid="sensor-file-input"
        style={{ display: 'none' }}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          e.currentTarget.value = '';
          if (!file) return;
          if (file.size > SENSOR_CSV_MAX_BYTES) {
            onError(`That file is ${(file.size / 1e6).toFixed(1)} MB; Frameside takes logger files up to ${SENSOR_CSV_MAX_BYTES / 1024 / 1024} MB. Split it and import the parts.`);
            return;
          }
          file
            .text()
            .then((text) => onFile({ name: file.name, size: file.size, text }))
            .catch(() => onError('The file could not be read.'));
        }}
      />
      <BigButton testID="sensor-pick-file" variant="secondary" label={label} onPress={() => input.current?.click()} />
    </>
  );
}
