/** Plain decimal numbers only: Number() would also read "0x10" as 16, "0b1" as 1 and "" as 0. */
export const DECIMAL_TEXT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
