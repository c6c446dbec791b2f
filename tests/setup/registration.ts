/** An invented registration mark of the Q series, which no State uses as its nationality mark (from memory). */
export const inventedMark = () =>
  `QX-${Array.from({ length: 5 }, () => String.fromCharCode(65 + Math.floor(Math.random() * 26))).join('')}`;
