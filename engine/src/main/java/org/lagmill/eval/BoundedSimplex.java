package org.lagmill.eval;

/**
 * Nelder–Mead minimisation inside a box, for a handful of parameters. Each parameter lives in {@code (lower, upper)}
 * through a logistic map of an unbounded coordinate, so the simplex moves freely and never leaves the box (a bound is
 * approached, never reached). Coefficients are the classic ones (reflection 1, expansion 2, contraction ½, shrink ½)
 * of J. A. Nelder and R. Mead, "A simplex method for function minimization", <i>The Computer Journal</i> 7(4), 1965.
 *
 * <p>Scratch arrays are allocated once for the largest dimension and reused by every {@link #minimise} call; not
 * thread-safe.
 */
final class BoundedSimplex {
  /** The function to minimise, given parameters inside their bounds. */
  interface Objective {
    double value(double[] parameters);
  }

  /** Step of the initial simplex in the unbounded coordinates (about a factor e in the odds of a unit interval). */
  private static final double INITIAL_STEP = 1.0;

  private final int maxDimension;
  private final double[][] vertices;
  private final double[] values;
  private final double[] centroid;
  private final double[] reflected;
  private final double[] expanded;
  private final double[] contracted;
  private final double[] mapped;
  private double[] lower;
  private double[] upper;
  private int evaluationCount;

  BoundedSimplex(int maxDimension) {
    this.maxDimension = maxDimension;
    this.vertices = new double[maxDimension + 1][maxDimension];
    this.values = new double[maxDimension + 1];
    this.centroid = new double[maxDimension];
    this.reflected = new double[maxDimension];
    this.expanded = new double[maxDimension];
    this.contracted = new double[maxDimension];
    this.mapped = new double[maxDimension];
  }

  /**
   * Minimises {@code objective} from {@code start} and writes the best parameters found into {@code start}.
   *
   * @param start starting parameters, each strictly inside its bounds; overwritten with the result
   * @param lowerBounds lower bound of each parameter
   * @param upperBounds upper bound of each parameter, above the lower one
   * @param maxEvaluations evaluation budget
   * @param relativeTolerance stop when the simplex's values differ by less than this fraction of the best value
   * @return the objective at the returned parameters
   */
  double minimise(Objective objective, double[] start, double[] lowerBounds, double[] upperBounds, int dimension,
      int maxEvaluations, double relativeTolerance) {
    if (dimension < 1 || dimension > maxDimension) {
      throw new IllegalArgumentException("dimension " + dimension + " outside 1.." + maxDimension);
    }
    this.lower = lowerBounds;
    this.upper = upperBounds;
    evaluationCount = 0;
    for (int i = 0; i < dimension; i++) {
      double fraction = (start[i] - lowerBounds[i]) / (upperBounds[i] - lowerBounds[i]);
      vertices[0][i] = Math.log(fraction / (1 - fraction));
    }
    for (int v = 1; v <= dimension; v++) {
      System.arraycopy(vertices[0], 0, vertices[v], 0, dimension);
      vertices[v][v - 1] += INITIAL_STEP;
    }
    for (int v = 0; v <= dimension; v++) {
      values[v] = evaluate(objective, vertices[v], dimension);
    }
    while (evaluationCount < maxEvaluations) {
      sortVertices(dimension);
      double best = values[0];
      double worst = values[dimension];
      if (Math.abs(worst - best) <= relativeTolerance * (Math.abs(best) + 1e-12)) {
        break;
      }
      java.util.Arrays.fill(centroid, 0, dimension, 0);
      for (int v = 0; v < dimension; v++) {
        for (int i = 0; i < dimension; i++) {
          centroid[i] += vertices[v][i] / dimension;
        }
      }
      double[] worstVertex = vertices[dimension];
      for (int i = 0; i < dimension; i++) {
        reflected[i] = centroid[i] + (centroid[i] - worstVertex[i]);
      }
      double reflectedValue = evaluate(objective, reflected, dimension);
      if (reflectedValue < best) {
        for (int i = 0; i < dimension; i++) {
          expanded[i] = centroid[i] + 2 * (centroid[i] - worstVertex[i]);
        }
        double expandedValue = evaluate(objective, expanded, dimension);
        if (expandedValue < reflectedValue) {
          replaceWorst(expanded, expandedValue, dimension);
        } else {
          replaceWorst(reflected, reflectedValue, dimension);
        }
      } else if (reflectedValue < values[dimension - 1]) {
        replaceWorst(reflected, reflectedValue, dimension);
      } else {
        boolean outside = reflectedValue < worst;
        double[] from = outside ? reflected : worstVertex;
        for (int i = 0; i < dimension; i++) {
          contracted[i] = centroid[i] + 0.5 * (from[i] - centroid[i]);
        }
        double contractedValue = evaluate(objective, contracted, dimension);
        if (contractedValue < Math.min(worst, outside ? reflectedValue : worst)) {
          replaceWorst(contracted, contractedValue, dimension);
        } else {
          for (int v = 1; v <= dimension; v++) {
            for (int i = 0; i < dimension; i++) {
              vertices[v][i] = vertices[0][i] + 0.5 * (vertices[v][i] - vertices[0][i]);
            }
            values[v] = evaluate(objective, vertices[v], dimension);
          }
        }
      }
    }
    sortVertices(dimension);
    toBounded(vertices[0], start, dimension);
    return values[0];
  }

  /** Objective evaluations made by the last {@link #minimise} call. */
  int evaluationCount() {
    return evaluationCount;
  }

  private double evaluate(Objective objective, double[] unbounded, int dimension) {
    evaluationCount++;
    toBounded(unbounded, mapped, dimension);
    double value = objective.value(mapped);
    // A NaN (an invalid parameter point) must lose every comparison, so it is read as +infinity.
    return Double.isNaN(value) ? Double.POSITIVE_INFINITY : value;
  }

  private void toBounded(double[] unbounded, double[] dst, int dimension) {
    for (int i = 0; i < dimension; i++) {
      dst[i] = lower[i] + (upper[i] - lower[i]) / (1 + Math.exp(-unbounded[i]));
    }
  }

  private void replaceWorst(double[] point, double value, int dimension) {
    System.arraycopy(point, 0, vertices[dimension], 0, dimension);
    values[dimension] = value;
  }

  /** Insertion sort of the vertices by value, best first (at most five vertices). */
  private void sortVertices(int dimension) {
    for (int v = 1; v <= dimension; v++) {
      double value = values[v];
      double[] vertex = vertices[v];
      int w = v - 1;
      while (w >= 0 && values[w] > value) {
        values[w + 1] = values[w];
        vertices[w + 1] = vertices[w];
        w--;
      }
      values[w + 1] = value;
      vertices[w + 1] = vertex;
    }
  }
}
