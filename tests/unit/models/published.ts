/**
 * Published worked examples used by the model tests. Each names its source.
 */

// Source: Montgomery, Design and Analysis of Experiments, ch. 11, chemical process yield: central
// composite design in coded time x1 and temperature x2 (α = 1.414, five centre runs), data as printed.
export const yieldCcd = {
  coded: [[-1, -1], [-1, 1], [1, -1], [1, 1], [0, 0], [0, 0], [0, 0], [0, 0], [0, 0], [1.414, 0], [-1.414, 0], [0, 1.414], [0, -1.414]],
  response: [76.5, 77.0, 78.0, 79.5, 79.9, 80.3, 80.0, 79.7, 79.8, 78.4, 75.6, 78.5, 77.0],
};
