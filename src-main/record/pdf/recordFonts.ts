import { existsSync } from 'node:fs';
import { dirname, join, parse } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The three embedded faces of a decision record, as pdfkit font names. */
export const FONT_REGULAR = 'TallylineSans';
export const FONT_BOLD = 'TallylineSansBold';
export const FONT_MONO = 'TallylineMono';

export interface RecordFontFiles {
  regular: string;
  bold: string;
  mono: string;
}

const FILE_NAMES: RecordFontFiles = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  mono: 'DejaVuSansMono.ttf',
};

/**
 * Finds `assets/fonts` by walking up from this module, so the same code works from the sources
 * (src-main/record) and from the build output (build/main/record). The fonts ship with the app:
 * a record never depends on fonts installed on the machine, and PDF/A needs them embedded.
 */
export function findRecordFonts(startDirectory = dirname(fileURLToPath(import.meta.url))): RecordFontFiles {
  let directory = startDirectory;
  for (;;) {
    const candidate = join(directory, 'assets', 'fonts');
    if (existsSync(join(candidate, FILE_NAMES.regular))) {
      return {
        regular: join(candidate, FILE_NAMES.regular),
        bold: join(candidate, FILE_NAMES.bold),
        mono: join(candidate, FILE_NAMES.mono),
      };
    }
    if (directory === parse(directory).root) break;
    directory = dirname(directory);
  }
  throw new Error(`decision record: assets/fonts/${FILE_NAMES.regular} not found above ${startDirectory}`);
}
