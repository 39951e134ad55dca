/** Plain-text wording for a list of cells, shared by the terminal, the report and the batch index. */

/** "cell 3", "cells 4–7 and 9" (1-based numbers, in order). */
export function describeCells(numbers: number[]): string {
  const ranges: string[] = [];
  for (let i = 0; i < numbers.length; i++) {
    let j = i;
    while (j + 1 < numbers.length && numbers[j + 1] === numbers[j]! + 1) j++;
    ranges.push(j > i ? `${numbers[i]}–${numbers[j]}` : String(numbers[i]));
    i = j;
  }
  const list = ranges.length > 1 ? `${ranges.slice(0, -1).join(", ")} and ${ranges.at(-1)}` : ranges[0]!;
  return `${numbers.length === 1 ? "cell" : "cells"} ${list}`;
}
