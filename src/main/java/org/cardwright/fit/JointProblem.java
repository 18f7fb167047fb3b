package org.cardwright.fit;

import java.util.List;
import org.apache.commons.math3.linear.RealMatrix;
import org.cardwright.model.DiodeParameters;

/**
 * All residual blocks stacked into one least-squares problem for the optimiser (target: zero), evaluated lazily
 * ({@link LazyModel}).
 */
final class JointProblem extends LazyModel {
    private final List<ResidualBlock> blocks;
    private final FreeParameters layout;
    private final int rows;

    JointProblem(List<ResidualBlock> blocks, FreeParameters layout) {
        this.blocks = List.copyOf(blocks);
        this.layout = layout;
        this.rows = blocks.stream().mapToInt(ResidualBlock::size).sum();
    }

    int rows() {
        return rows;
    }

    /** All weighted residuals, block after block. */
    double[] residuals(DiodeParameters p) {
        double[] out = new double[rows];
        int at = 0;
        for (ResidualBlock b : blocks) {
            double[] r = b.residuals(p);
            System.arraycopy(r, 0, out, at, r.length);
            at += r.length;
        }
        return out;
    }

    /** Sum of squared weighted residuals. */
    double chiSquare(DiodeParameters p) {
        double s = 0;
        for (double r : residuals(p)) {
            s += r * r;
        }
        return s;
    }

    RealMatrix jacobian(double[] x) {
        double[][] jac = new double[rows][];
        int at = 0;
        for (ResidualBlock b : blocks) {
            double[][] part = b.jacobian(layout, x);
            System.arraycopy(part, 0, jac, at, part.length);
            at += part.length;
        }
        return new JacobianMatrix(jac);
    }

    @Override
    double[] residualsAt(double[] x) {
        return residuals(layout.toParameters(x));
    }

    @Override
    RealMatrix jacobianAt(double[] x) {
        return jacobian(x);
    }
}
