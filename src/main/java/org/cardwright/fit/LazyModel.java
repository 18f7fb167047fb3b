package org.cardwright.fit;

import org.apache.commons.math3.fitting.leastsquares.ValueAndJacobianFunction;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;

/**
 * A least-squares model for Commons Math's lazy evaluation: the optimiser asks for the residuals and the Jacobian
 * separately, so that a trial step it rejects costs no Jacobian; the residuals of the last point asked for are kept,
 * since the optimiser asks for them twice at an accepted point. The same numbers as one evaluation of both.
 */
abstract class LazyModel implements ValueAndJacobianFunction {
    /** The point of the last {@link #computeValue} call and its residuals. */
    private double[] lastPoint;
    private RealVector lastValue;

    /** The weighted residuals at the optimiser's vector {@code x}. */
    abstract double[] residualsAt(double[] x);

    /** Their Jacobian at {@code x}. */
    abstract RealMatrix jacobianAt(double[] x);

    @Override
    public final Pair<RealVector, RealMatrix> value(RealVector point) {
        double[] x = point.toArray();
        return new Pair<>(computeValue(x), jacobianAt(x));
    }

    @Override
    public final RealVector computeValue(double[] x) {
        if (lastPoint == null || !java.util.Arrays.equals(lastPoint, x)) {
            lastValue = new ArrayRealVector(residualsAt(x), false);
            lastPoint = x.clone();
        }
        return lastValue;
    }

    @Override
    public final RealMatrix computeJacobian(double[] x) {
        return jacobianAt(x);
    }
}
