/**
 * The progress line of a command with many runs, on a terminal only: "12 of 200 runs done, 1 failed, about 40 s
 * left", redrawn in place on the error stream (it never reaches a file or a pipe, where each run's own line is all
 * that is printed). Time left is the mean time per finished run so far times the runs still to go, over the jobs.
 */
import { formatDuration } from "../text/duration.ts";

/** Keeps and draws the progress line; `write` gets raw terminal text (carriage return and erase-line). */
export class ProgressLine {
  private done = 0;
  private failed = 0;
  private shown = false;
  private readonly startedAt: number;

  constructor(
    private readonly total: number,
    private readonly write: (text: string) => void,
    private readonly now: () => number = Date.now,
  ) {
    this.startedAt = now();
  }

  /** The text of the line as it stands. */
  text(): string {
    const runs = this.total === 1 ? "1 run" : `${this.total} runs`;
    let text = `${this.done} of ${runs} done, ${this.failed} failed`;
    if (this.done > 0 && this.done < this.total) {
      const left = ((this.now() - this.startedAt) / this.done) * (this.total - this.done);
      text += `, about ${formatDuration(left)} left`;
    }
    return text;
  }

  /** Counts a finished run and redraws the line. */
  finished(failed: boolean): void {
    this.done++;
    if (failed) this.failed++;
    this.draw();
  }

  /** Draws the line (after other output has been printed above it). */
  draw(): void {
    this.write(`\r\x1b[2K${this.text()}`);
    this.shown = true;
  }

  /** Erases the line, so that the next printed line starts at the left margin. */
  clear(): void {
    if (this.shown) this.write("\r\x1b[2K");
    this.shown = false;
  }
}
