import { useState, type ReactNode } from 'react';
import { buttonClass } from './Button';

/**
 * Choose a file with a button or drop one on the box. `onFile` gets the first file; the input is
 * cleared after each choice, so choosing the same file again (after fixing it) reads it again.
 */
export function FileDrop({
  label,
  accept,
  disabled = false,
  onFile,
  children,
}: {
  /** The button's text. */
  label: ReactNode;
  /** The input's accept list (types and extensions). */
  accept: string;
  disabled?: boolean;
  onFile: (file: File) => void;
  /** What the box says beside the button: what to drop and what happens to it. */
  children: ReactNode;
}) {
  const [dragging, setDragging] = useState(false);
  return (
    <div
      onDragOver={(event) => {
        event.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={(event) => {
        event.preventDefault();
        setDragging(false);
        const file = event.dataTransfer.files[0];
        if (file) onFile(file);
      }}
      className={`flex flex-wrap items-center gap-x-4 gap-y-3 rounded-lg border-2 border-dashed px-5 py-4 transition-colors ${
        dragging ? 'border-teal bg-teal-light/40' : 'border-ink/20 bg-white/50'
      }`}
    >
      <label
        className={`${buttonClass('primary')} cursor-pointer has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-teal`}
      >
        {label}
        <input
          type="file"
          accept={accept}
          className="sr-only"
          disabled={disabled}
          onChange={(event) => {
            const file = event.target.files?.[0];
            event.target.value = '';
            if (file) onFile(file);
          }}
        />
      </label>
      <p className="max-w-prose text-sm text-ink-soft">{children}</p>
    </div>
  );
}
