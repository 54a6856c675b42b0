/* example.c: classifies one pump reading with the generated pump_state_classifier.c.
 * Build: cc -std=c99 -Os example.c pump_state_classifier.c -o example */
#include <stdio.h>
#include "pump_state_classifier.h"

int main(void)
{
    /* One reading, in the order the header lists the features. */
    const float reading[PUMP_STATE_CLASSIFIER_FEATURE_COUNT] = {
        1.19f,  /* vibration_rms_mm_s */
        0.474f, /* peak_accel_g */
        3.31f,  /* crest_factor */
        4.00f,  /* kurtosis */
        45.6f,  /* bearing_temp_c */
        16.51f  /* motor_current_a */
    };
    int state = pump_state_classifier_classify(reading);
    printf("state: %s\n", pump_state_classifier_label(state));
    return state == PUMP_STATE_CLASSIFIER_CLASS_NORMAL ? 0 : 1;
}
