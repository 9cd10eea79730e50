import { InvalidInputError } from '@/server/errors';

/** A campaign file of a million ~60–100 character rows is about 100 MB; far more is not a site list. */
export const CAMPAIGN_UPLOAD_MAX_BYTES = 200 * 1024 * 1024;

/**
 * The one place for what makes a campaign file readable text: UTF-8 (a leading BOM is the
 * splitter's business), no NUL byte (a spreadsheet's binary format or an archive), not empty and
 * not over the size cap. Bytes arrive in pieces as the request streams in; a character split
 * between two pieces is joined (TextDecoder in stream mode), so the pieces' sizes never matter.
 * Every refusal is an InvalidInputError on the `file` field with the sentence the person reads.
 */
export class CampaignFileText {
  private readonly decoder = new TextDecoder('utf-8', { fatal: true });
  private bytes = 0;

  constructor(
    private readonly filename: string,
    private readonly maxBytes = CAMPAIGN_UPLOAD_MAX_BYTES,
  ) {}

  /** Bytes read so far. */
  get byteCount(): number {
    return this.bytes;
  }

  /** The text of the next piece (possibly '' while a character is incomplete). */
  decode(piece: Uint8Array): string {
    this.bytes += piece.byteLength;
    if (this.bytes > this.maxBytes) throw this.refuse(`"${this.filename}" is over ${formatMb(this.maxBytes)}; a campaign file of a million sites is about 100 MB. Split it into several campaigns.`);
    if (piece.includes(0)) throw this.refuse(`"${this.filename}" is not a text CSV file (it contains binary data). Save it from your spreadsheet as CSV.`);
    return this.text(() => this.decoder.decode(piece, { stream: true }));
  }

  /** The end of the file: what an incomplete last character left (an error), and the empty-file check. */
  end(): string {
    const rest = this.text(() => this.decoder.decode());
    if (this.bytes === 0) throw this.refuse(`"${this.filename}" is empty.`);
    return rest;
  }

  refuse(message: string): InvalidInputError {
    return new InvalidInputError(message, { file: [message] });
  }

  private text(decode: () => string): string {
    try {
      return decode();
    } catch {
      throw this.refuse(`"${this.filename}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".`);
    }
  }
}

const formatMb = (bytes: number) => (bytes >= 1024 * 1024 ? `${Math.round(bytes / 1024 / 1024)} MB` : `${Math.ceil(bytes / 1024)} KiB`);
