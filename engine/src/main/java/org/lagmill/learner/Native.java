package org.lagmill.learner;

import com.microsoft.ml.lightgbm.SWIGTYPE_p_double;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_float;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_int;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_p_void;
import com.microsoft.ml.lightgbm.SWIGTYPE_p_void;
import com.microsoft.ml.lightgbm.lightgbmlib;

/**
 * Small helpers over the SWIG layer: pointer wrappers around our own native addresses (so row batches and label
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

  static SWIGTYPE_p_float floatPointer(long address) {
    return new FloatPointer(address);
  }

  /** Native address behind a SWIG {@code double*} (e.g. from {@code new_doubleArray}). */
  static long addressOf(SWIGTYPE_p_double pointer) {
    return DoublePointer.address(pointer);
  }

  static long addressOf(SWIGTYPE_p_int pointer) {
    return IntPointer.address(pointer);
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

  private static final class FloatPointer extends SWIGTYPE_p_float {
    FloatPointer(long address) {
      super(address, false);
    }
  }

  private static final class DoublePointer extends SWIGTYPE_p_double {
    private DoublePointer() {
    }

    static long address(SWIGTYPE_p_double pointer) {
      return getCPtr(pointer);
    }
  }

  private static final class IntPointer extends SWIGTYPE_p_int {
    private IntPointer() {
    }

    static long address(SWIGTYPE_p_int pointer) {
      return getCPtr(pointer);
    }
  }
}
