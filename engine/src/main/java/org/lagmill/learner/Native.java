package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;

/**
 * Small helpers over the SWIG layer: a pointer wrapper around our own native addresses (so row batches and label
 * arrays reach LightGBM with no per-value JNI call) and return-code checking.
 */
final class Native {
  private Native() {
  }

  /** Throws {@link LearnerException} with LightGBM's last error when {@code returnCode} is not 0. */
  static void check(int returnCode, String call) {
    if (returnCode != 0) {
      throw new LearnerException("LightGBM " + call + " failed (code " + returnCode + "): "
          + lightgbmlib.LGBM_GetLastError());
    }
  }

  /** A {@code void*} holding {@code address}; SWIG does not own (and never frees) the memory behind it. */
  static SWIGTYPE_p_void voidPointer(long address) {
    return new VoidPointer(address);
  }

  /** A {@code double*} holding {@code address}, for LightGBM to write results into our own native memory. */
  static SWIGTYPE_p_double doublePointer(long address) {
    return new DoublePointer(address);
  }

  /** Reads the handle a {@code LGBM_*Create*} call wrote into {@code out}, then frees {@code out}. */
  static SWIGTYPE_p_void takeHandle(SWIGTYPE_p_p_void out) {
    try {
      return lightgbmlib.voidpp_value(out);
    } finally {
      lightgbmlib.delete_voidpp(out);
    }
  }

  private static final class VoidPointer extends SWIGTYPE_p_void {
    VoidPointer(long address) {
      super(address, false);
    }
  }

  private static final class DoublePointer extends SWIGTYPE_p_double {
    DoublePointer(long address) {
      super(address, false);
    }
  }
}
