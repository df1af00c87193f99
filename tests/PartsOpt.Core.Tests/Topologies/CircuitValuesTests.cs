using PartsOpt.Topologies;

namespace PartsOpt.Tests.Topologies;

public class CircuitValuesTests
{
    [Fact]
    public void Each_slot_writes_the_field_of_its_name_and_no_other()
    {
        // Set writes by offset (the slots are the fields in declaration order). Checked against the fields
        // found by name through reflection: the slot's own field holds the value, every other stays 0.
        var fields = typeof(CircuitValues).GetFields();
        Assert.Equal(Enum.GetValues<Slot>().Length, fields.Length);
        foreach (var slot in Enum.GetValues<Slot>())
        {
            var values = default(CircuitValues);
            values.Set(slot, 42.5);
            object boxed = values;
            foreach (var field in fields)
                Assert.Equal(field.Name == slot.ToString() ? 42.5 : 0.0, (double)field.GetValue(boxed)!);
        }
    }

    [Fact]
    public void A_slot_outside_the_struct_is_refused()
    {
        var values = default(CircuitValues);
        Assert.Throws<ArgumentOutOfRangeException>(() => values.Set((Slot)22, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => values.Set((Slot)(-1), 1));
    }
}
