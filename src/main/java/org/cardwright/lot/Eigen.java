package org.cardwright.lot;

/**
 * Eigenvalues and eigenvectors of a small symmetric matrix by the cyclic Jacobi method: plane rotations that
 * zero the off-diagonal elements one by one, repeated until they vanish. Deterministic (a fixed sweep order), so
 * the same matrix always gives the same bytes. C. G. J. Jacobi, "Ueber ein leichtes Verfahren, die in der Theorie
 * der Saecularstoerungen vorkommenden Gleichungen numerisch aufzuloesen", J. reine angew. Math. 30 (1846) 51-94;
 * as given by G. H. Golub and C. F. Van Loan, "Matrix Computations", 4th ed., Johns Hopkins University Press 2013,
 * section 8.5 (recalled).
 *
 * @param values  eigenvalues, largest first
 * @param vectors eigenvectors as columns, {@code vectors[row][k]} belongs to {@code values[k]}; each column's
 *                largest-magnitude element is positive (a fixed sign, for byte-stable output)
 */
public record Eigen(double[] values, double[][] vectors) {
    private static final int MAX_SWEEPS = 100;

    static Eigen of(double[][] symmetric) {
        int n = symmetric.length;
        double[][] a = new double[n][];
        for (int i = 0; i < n; i++) {
            a[i] = symmetric[i].clone();
        }
        double[][] v = new double[n][n];
        for (int i = 0; i < n; i++) {
            v[i][i] = 1;
        }
        for (int sweep = 0; sweep < MAX_SWEEPS; sweep++) {
            double off = 0;
            double scale = 0;
            for (int i = 0; i < n; i++) {
                scale += a[i][i] * a[i][i];
                for (int j = i + 1; j < n; j++) {
                    off += a[i][j] * a[i][j];
                }
            }
            if (off <= 1e-30 * Math.max(scale, Double.MIN_NORMAL)) {
                break;
            }
            for (int p = 0; p < n; p++) {
                for (int q = p + 1; q < n; q++) {
                    if (a[p][q] == 0) {
                        continue;
                    }
                    double theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
                    double t = Math.signum(theta) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
                    if (theta == 0) {
                        t = 1;
                    }
                    double c = 1 / Math.sqrt(t * t + 1);
                    double s = t * c;
                    for (int k = 0; k < n; k++) {
                        double akp = a[k][p];
                        double akq = a[k][q];
                        a[k][p] = c * akp - s * akq;
                        a[k][q] = s * akp + c * akq;
                    }
                    for (int k = 0; k < n; k++) {
                        double apk = a[p][k];
                        double aqk = a[q][k];
                        a[p][k] = c * apk - s * aqk;
                        a[q][k] = s * apk + c * aqk;
                    }
                    for (int k = 0; k < n; k++) {
                        double vkp = v[k][p];
                        double vkq = v[k][q];
                        v[k][p] = c * vkp - s * vkq;
                        v[k][q] = s * vkp + c * vkq;
                    }
                }
            }
        }
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, (x, y) -> Double.compare(a[y][y], a[x][x]));
        double[] values = new double[n];
        double[][] vectors = new double[n][n];
        for (int k = 0; k < n; k++) {
            int col = order[k];
            values[k] = a[col][col];
            int big = 0;
            for (int r = 0; r < n; r++) {
                if (Math.abs(v[r][col]) > Math.abs(v[big][col])) {
                    big = r;
                }
            }
            double sign = v[big][col] < 0 ? -1 : 1;
            for (int r = 0; r < n; r++) {
                vectors[r][k] = sign * v[r][col];
            }
        }
        return new Eigen(values, vectors);
    }
}
