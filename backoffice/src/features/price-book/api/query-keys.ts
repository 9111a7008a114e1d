/** The published price book; publishing a new one invalidates `all`. */
export const priceBookKeys = {
  all: ['price-book'] as const,
  current: () => [...priceBookKeys.all, 'current'] as const,
};
