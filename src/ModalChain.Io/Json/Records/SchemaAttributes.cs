namespace ModalChain.Io.Json.Records;

/// <summary>The one value a string property of an output record may take, published as the schema's <c>const</c>.</summary>
/// <param name="value">The value, e.g. <see cref="JsonFormat.Version"/>.</param>
[AttributeUsage(AttributeTargets.Property)]
public sealed class SchemaConstAttribute(string value) : Attribute
{
    /// <summary>The value.</summary>
    public string Value { get; } = value;
}

/// <summary>The values a string property of an output record may take, published as the schema's <c>enum</c>.</summary>
/// <param name="values">Every value the mapping writes.</param>
[AttributeUsage(AttributeTargets.Property)]
public sealed class SchemaEnumAttribute(params string[] values) : Attribute
{
    /// <summary>The values.</summary>
    public IReadOnlyList<string> Values { get; } = values;
}
