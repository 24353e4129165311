namespace EventReview.Core.Chain;

/// <summary>Sample-by-sample traces of one stage, for pictures (not meant to be stored).</summary>
/// <param name="Stage">1-based stage number.</param>
/// <param name="StartGps">GPS time of sample 0 of the aligned traces, seconds.</param>
/// <param name="SampleRateHz">Sample rate, Hz.</param>
/// <param name="Recorded">Recorded output over the common span of input and output.</param>
/// <param name="Predicted">Output predicted from the input by the stage model.</param>
/// <param name="Residual">Recorded - predicted.</param>
/// <param name="FirstValid">First sample used in the statistics (after the settling skip).</param>
/// <param name="LastValid">Last sample used in the statistics.</param>
public sealed record ChainStageTrace(int Stage, double StartGps, double SampleRateHz, double[] Recorded, double[] Predicted, double[] Residual, int FirstValid, int LastValid);
