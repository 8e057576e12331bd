"use client";
/// The keyboard reference shown by the help command.
import { kbd } from "./styles";

/// Every shortcut of the console, in one table.
export const SHORTCUTS: readonly (readonly [string, string])[] = [
  ["Ctrl+K / ⌘K", "command palette"],
  ["Enter", "run the input"],
  ["Shift+Enter", "new line in the input"],
  ["↑ / ↓ at the first / last line", "recall earlier inputs"],
  ["Ctrl+Space", "complete a name, property or option"],
  ["Alt+R", "search the input history"],
  ["Alt+X", "cancel the running cell"],
  ["Alt+N", "new session"],
  ["Alt+O", "go to the sessions list"],
  ["Alt+S", "go to the named objects"],
  ["Alt+I", "go to the input"],
  ["Alt+G", "guided first steps"],
  ["Alt+E", "export the transcript or import a session"],
  ["Alt+T", "switch between light and dark"],
  ["Alt+/", "this help"],
  ["Escape", "close a dialog or the completion list"],
];

/// The shortcuts as a table.
export function KeyboardHelp() {
  return (
    <table className="text-sm">
      <caption className="sr-only">Keyboard shortcuts</caption>
      <tbody>
        {SHORTCUTS.map(([keys, what]) => (
          <tr key={keys}>
            <th scope="row" className="py-0.5 pr-4 text-left font-normal">
              <kbd className={kbd}>{keys}</kbd>
            </th>
            <td>{what}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
