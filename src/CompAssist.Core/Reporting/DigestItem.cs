namespace CompAssist.Core.Reporting;

/// <summary>One item of a <see cref="ProofDigest"/>.</summary>
/// <param name="Text">Short text, e.g. "OS% 9.6 ≤ 10".</param>
/// <param name="Passes">True pass, false fail, null for information only.</param>
public sealed record DigestItem(string Text, bool? Passes);
