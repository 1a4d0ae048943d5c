/** Every books query key starts here, so a change to the books can refresh them all. */
export const booksKey = ['books'] as const;
