/**
 * The board page's first HTML carries the board's data in a JSON script element (read, never run),
 * so the page needs no second request on a weak signal. It is read once, by the first board page of
 * the visit (the one whose URL served it), and removed, so any later board asks the server.
 */
export const BOARD_DATA_ELEMENT_ID = 'wm-board-data';
