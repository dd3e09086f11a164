import { useState, type ComponentProps, type ReactNode, type Ref } from 'react';
import { cn } from './cn';

/**
 * A dashed panel that takes files dropped onto it, highlighted while files are dragged over.
 * Its label names the region ("Choose a point file"); put the file buttons inside.
 */
export function DropZone({ label, onFiles, className, children }: {
  label: string;
  onFiles: (files: FileList) => void;
  className?: string;
  children: ReactNode;
}) {
  const [dragging, setDragging] = useState(false);
  return (
    <section
      aria-label={label}
      onDragOver={(e) => {
        e.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={(e) => {
        e.preventDefault();
        setDragging(false);
        onFiles(e.dataTransfer.files);
      }}
      className={cn('space-y-3 rounded-lg border-2 border-dashed p-4', dragging ? 'border-brand-500 bg-brand-50' : 'border-ink-300 bg-white', className)}
    >
      {children}
    </section>
  );
}

/**
 * A file input kept out of sight and out of the tab order: a visible button opens it through
 * `ref` (`ref.current?.click()`). The label is its accessible name (tests set files by it). After
 * each choice it forgets the file, so choosing the same file again still reports it.
 */
export function HiddenFileInput({ ref, label, onFiles, ...props }: {
  ref: Ref<HTMLInputElement>;
  label: string;
  onFiles: (files: FileList | null) => void;
} & Omit<ComponentProps<'input'>, 'ref' | 'type' | 'className' | 'tabIndex' | 'aria-label' | 'onChange'>) {
  return (
    <input
      ref={ref}
      type="file"
      className="sr-only"
      tabIndex={-1}
      aria-label={label}
      onChange={(e) => {
        onFiles(e.target.files);
        e.target.value = '';
      }}
      {...props}
    />
  );
}
