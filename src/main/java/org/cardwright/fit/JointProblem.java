package org.cardwright.fit;

import java.util.List;
import org.apache.commons.math3.fitting.leastsquares.ValueAndJacobianFunction;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;
import org.cardwright.model.DiodeParameters;

/**
 * All residual blocks stacked into one least-squares problem for the optimiser (target: zero). The optimiser asks
 * for the residuals and the Jacobian separately ({@link ValueAndJacobianFunction}, Commons Math's lazy evaluation),
 * so that a trial step it rejects costs no Jacobian; the same numbers as one evaluation of both.
 */
final class JointProblem implements ValueAndJacobianFunction {
    private final List<ResidualBlock> blocks;
    private final FreeParameters layout;
    private final int rows;
    /** The point of the last {@link #computeValue} call and its residuals (the optimiser asks twice a point). */
    private double[] lastPoint;
    private RealVector lastValue;

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
    public Pair<RealVector, RealMatrix> value(RealVector point) {
        double[] x = point.toArray();
        return new Pair<>(computeValue(x), jacobian(x));
    }

    @Override
    public RealVector computeValue(double[] x) {
        if (lastPoint == null || !java.util.Arrays.equals(lastPoint, x)) {
            lastValue = new ArrayRealVector(residuals(layout.toParameters(x)), false);
            lastPoint = x.clone();
        }
        return lastValue;
    }

    @Override
    public RealMatrix computeJacobian(double[] x) {
        return jacobian(x);
    }
}
