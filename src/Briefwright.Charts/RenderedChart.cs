namespace Briefwright.Charts;

/// <summary>A chart ready to place: a one-page vector PDF of <see cref="WidthPt"/> × <see cref="HeightPt"/> points, plus its texts.</summary>
public sealed record RenderedChart(string Id, byte[] Pdf, double WidthPt, double HeightPt, string Caption, string AltText, string Source);
