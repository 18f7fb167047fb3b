package org.cardwright.fit;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * A Jacobian handed to Commons Math's Levenberg-Marquardt optimiser. Its QR step begins with
 * {@code jacobian.scalarMultiply(-1).getData()}, which the library's general matrix does entry by entry through
 * checked accessors (a tenth of a library build's time under the C1 compiler), then copies the result; this one
 * multiplies the rows directly and hands them over. The same products, so the same numbers.
 */
final class JacobianMatrix extends Array2DRowRealMatrix {
    private static final long serialVersionUID = 1L;

    /** Wraps {@code rows} (one array per residual, all of one length) without copying. */
    JacobianMatrix(double[][] rows) {
        super(rows, false);
    }

    @Override
    public RealMatrix scalarMultiply(double d) {
        double[][] in = getDataRef();
        double[][] out = new double[in.length][];
        for (int i = 0; i < in.length; i++) {
            double[] row = in[i];
            double[] scaled = new double[row.length];
            for (int j = 0; j < row.length; j++) {
                scaled[j] = row[j] * d;
            }
            out[i] = scaled;
        }
        return new Unshared(out);
    }

    /**
     * A product no one else holds: {@link #getData} hands out its rows instead of a copy, as the optimiser's QR step
     * copies them only to overwrite the copy.
     */
    private static final class Unshared extends Array2DRowRealMatrix {
        private static final long serialVersionUID = 1L;

        Unshared(double[][] rows) {
            super(rows, false);
        }

        @Override
        public double[][] getData() {
            return getDataRef();
        }
    }
}
