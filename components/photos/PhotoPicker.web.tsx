// Choosing a photo on the web: a plain file input behind a button in Falloff's look.
import { useRef } from 'react';
import { Button } from '../ui';
import { ACCEPT, type PhotoPickerProps } from './pickerTypes';

export function PhotoPicker({ onPick, busy, label }: PhotoPickerProps) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        accept={ACCEPT}
        aria-label={label}
        data-testid="photo-input"
        style={{ display: 'none' }}
        onChange={(e) => {
          const f = e.currentTarget.files?.[0];
          if (f) onPick({ blob: f, name: f.name });
          e.currentTarget.value = '';
        }}
      />
      <Button label={label} onPress={() => input.current?.click()} busy={busy} testID="attach-photo" />
    </>
  );
}
