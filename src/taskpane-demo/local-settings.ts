/**
 * Workbook settings kept in the browser's localStorage for the demo page, so a column mapping
 * survives a reload as it survives saving and reopening a file in Excel.
 */
import type { WorkbookPort } from "../workbook/port";

/** The part of the Storage API used here (localStorage in the page, a Map in tests). */
export interface SettingsStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

/**
 * A port that delegates everything to `port` except settings, which go to `storage`.
 * @param prefix - key prefix, one per sample workbook, so samples do not share settings.
 */
export function withStoredSettings(port: WorkbookPort, storage: SettingsStorage, prefix: string): WorkbookPort {
  return {
    listTables: () => port.listTables(),
    readTable: (ref) => port.readTable(ref),
    sheetNames: () => port.sheetNames(),
    sheetMarker: (sheet) => port.sheetMarker(sheet),
    prepareSheet: (sheet, marker, replaceForeign) => port.prepareSheet(sheet, marker, replaceForeign),
    writeBlock: (sheet, top, left, cells) => port.writeBlock(sheet, top, left, cells),
    setNames: (names) => port.setNames(names),
    select: (sheet, address) => port.select(sheet, address),
    flush: () => port.flush(),
    getSetting: async (key) => storage.getItem(prefix + key),
    setSetting: async (key, value) => storage.setItem(prefix + key, value),
    // Selection and pictures, where the wrapped workbook has them.
    ...(port.followsSelection ? { followsSelection: () => port.followsSelection!() } : {}),
    ...(port.onSelectionChanged ? { onSelectionChanged: (handler) => port.onSelectionChanged!(handler) } : {}),
    ...(port.activeCell ? { activeCell: () => port.activeCell!() } : {}),
    ...(port.canInsertPicture ? { canInsertPicture: () => port.canInsertPicture!() } : {}),
    ...(port.insertPicture ? { insertPicture: (sheet, picture) => port.insertPicture!(sheet, picture) } : {}),
  };
}
