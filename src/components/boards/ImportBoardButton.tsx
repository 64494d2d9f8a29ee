import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRef } from 'react';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { BOARD_FILE_MAX_BYTES } from '~/lib/schemas/board.ts';
import { importBoardFile } from './board-requests.ts';

/** "Import a design (JSON file)": uploads the chosen file as a new board; errors show beside it. */
export function ImportBoardButton() {
  const hydrated = useHydrated();
  const input = useRef<HTMLInputElement>(null);
  const client = useQueryClient();
  const upload = useMutation({
    mutationFn: (file: File) => {
      if (file.size > BOARD_FILE_MAX_BYTES) return Promise.reject(new Error('The file is larger than 256 KiB'));
      return importBoardFile(file);
    },
    onSettled: () => {
      if (input.current) input.current.value = '';
      return client.invalidateQueries({ queryKey: ['boards'] });
    },
  });
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label className="flex flex-col">
        Import a design (JSON file, up to 256 KiB)
        <input
          ref={input}
          type="file"
          accept="application/json,.json"
          disabled={!hydrated || upload.isPending}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) upload.mutate(file);
          }}
        />
      </label>
      {upload.isPending && <p role="status">Uploading…</p>}
      {upload.isSuccess && <p role="status">Imported as “{upload.data.name}”.</p>}
      {upload.isError && <p role="alert" className="text-rosewood">Not imported: {upload.error.message}</p>}
    </div>
  );
}
