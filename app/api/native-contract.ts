import { z } from 'zod';

/**
 * The desktop window's native helpers — file dialogs and print-to-PDF — as a contract like the
 * API's: name → zod input and output. Electron main registers one IPC handler per entry and
 * validates every input with it; the preload exposes exactly this map; the renderer falls back
 * to browser equivalents when the map is absent (browser mode).
 */
const fileFilter = z.strictObject({
  name: z.string().min(1).max(80),
  extensions: z
    .array(z.string().regex(/^[a-z0-9]{1,8}$/))
    .min(1)
    .max(10),
});

export const nativeContract = {
  openTextFile: {
    input: z.strictObject({ title: z.string().max(200), filters: z.array(fileFilter).max(10) }),
    /** null when the user cancels. */
    output: z.union([z.strictObject({ name: z.string(), content: z.string() }), z.null()]),
  },
  saveTextFile: {
    input: z.strictObject({
      title: z.string().max(200),
      defaultName: z.string().min(1).max(200),
      content: z.string().max(512 * 1024 * 1024),
      filters: z.array(fileFilter).max(10),
    }),
    output: z.strictObject({ saved: z.boolean() }),
  },
  saveImageFile: {
    input: z.strictObject({
      title: z.string().max(200),
      defaultName: z.string().min(1).max(200),
      /** PNG bytes, base64. */
      pngBase64: z
        .string()
        .regex(/^[A-Za-z0-9+/]*={0,2}$/)
        .max(64 * 1024 * 1024),
    }),
    output: z.strictObject({ saved: z.boolean() }),
  },
  printToPdf: {
    input: z.strictObject({ title: z.string().max(200), defaultName: z.string().min(1).max(200) }),
    output: z.strictObject({ saved: z.boolean() }),
  },
} as const;

export type NativeContract = typeof nativeContract;
export type NativeName = keyof NativeContract;
export type NativeInput<N extends NativeName> = z.input<NativeContract[N]['input']>;
export type NativeOutput<N extends NativeName> = z.output<NativeContract[N]['output']>;
