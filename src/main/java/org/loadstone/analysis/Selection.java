package org.loadstone.analysis;

/**
 * The k-th smallest of an array's first elements in expected linear time (Hoare's selection with
 * a median-of-three pivot), so that a median needs no sort.
 */
final class Selection {
  private Selection() {}

  /**
   * @param a values, finite; its first {@code n} elements are reordered
   * @param n how many elements count, at least 1
   * @param k rank, 0 ≤ k &lt; n
   * @return the value that {@code Arrays.sort(a, 0, n)} would put at index {@code k}
   */
  static double kth(double[] a, int n, int k) {
    if (k < 0 || k >= n || n > a.length) {
      throw new IllegalArgumentException("rank " + k + " outside 0…" + (n - 1));
    }
    int lo = 0;
    int hi = n - 1;
    while (hi > lo) {
      int mid = (lo + hi) >>> 1;
      // median of three to the middle, so sorted or reversed runs do not go quadratic
      if (a[mid] < a[lo]) {
        swap(a, mid, lo);
      }
      if (a[hi] < a[lo]) {
        swap(a, hi, lo);
      }
      if (a[hi] < a[mid]) {
        swap(a, hi, mid);
      }
      double pivot = a[mid];
      int i = lo;
      int j = hi;
      while (i <= j) {
        while (a[i] < pivot) {
          i++;
        }
        while (a[j] > pivot) {
          j--;
        }
        if (i <= j) {
          swap(a, i, j);
          i++;
          j--;
        }
      }
      if (k <= j) {
        hi = j;
      } else if (k >= i) {
        lo = i;
      } else {
        return a[k];
      }
    }
    return a[k];
  }

  private static void swap(double[] a, int i, int j) {
    double t = a[i];
    a[i] = a[j];
    a[j] = t;
  }
}
